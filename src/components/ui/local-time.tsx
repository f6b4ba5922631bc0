import { useEffect, useState } from 'react';

// The server does not know the reader's time zone: it prints UTC, and the browser replaces that with
// local time after hydration, so the first client render matches the server's HTML exactly.
const utcFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: 'UTC' });

/** Formats an ISO timestamp in UTC ("28 Nov 2026, 14:00 UTC"), or '' when it does not parse. */
export function formatUtcDateTime(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '' : `${utcFormat.format(date)} UTC`;
}

/** The reader's locale and zone; dateStyle cannot be combined with timeZoneName, so the parts are named. */
function localFormat(): Intl.DateTimeFormat {
  return new Intl.DateTimeFormat(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    timeZoneName: 'short',
  });
}

/** A date and time in the reader's own time zone (shown in UTC until the page has hydrated). */
export function LocalTime({ iso, className }: { iso: string; className?: string }) {
  const [local, setLocal] = useState<string | null>(null);
  useEffect(() => {
    const date = new Date(iso);
    if (Number.isNaN(date.getTime())) return;
    setLocal(localFormat().format(date));
  }, [iso]);
  return (
    <time dateTime={iso} className={className}>
      {local ?? formatUtcDateTime(iso)}
    </time>
  );
}
