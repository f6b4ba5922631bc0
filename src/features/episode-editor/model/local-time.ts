/** The reader's time zone name, for saying which zone a picked time is in ("Europe/London"). */
export function localTimeZoneName(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'your local time';
}

const pad = (n: number, width = 2) => String(Math.abs(n)).padStart(width, '0');

/**
 * A `datetime-local` value ("2026-12-05T18:30") read in the reader's time zone, as an ISO time
 * with that zone's offset on that date ("2026-12-05T18:30:00+01:00"), or null when it does not
 * name a real local time.
 */
export function localInputToIso(value: string): string | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/.exec(value);
  if (!m) return null;
  const [year, month, day, hour, minute, second] = m.slice(1).map((x) => Number(x ?? 0)) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  const date = new Date(year, month - 1, day, hour, minute, second);
  if (Number.isNaN(date.getTime())) return null;
  // A time skipped by a daylight-saving change moves; refuse it rather than publish at another hour.
  if (
    date.getFullYear() !== year ||
    date.getMonth() !== month - 1 ||
    date.getDate() !== day ||
    date.getHours() !== hour ||
    date.getMinutes() !== minute
  ) {
    return null;
  }
  const offset = -date.getTimezoneOffset();
  const sign = offset >= 0 ? '+' : '-';
  return `${year}-${pad(month)}-${pad(day)}T${pad(hour)}:${pad(minute)}:${pad(second)}${sign}${pad(Math.trunc(offset / 60))}:${pad(offset % 60)}`;
}

/** An ISO time as a `datetime-local` value in the reader's time zone. */
export function isoToLocalInput(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** An ISO time in the reader's own words and zone: "Sat 5 Dec 2026, 18:30". Browser only. */
export function formatLocalDateTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  return new Intl.DateTimeFormat(undefined, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  }).format(d);
}
