// Fixed locale and UTC so the server's HTML and the hydrating client print the same date.
const dateFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });

/** Formats an ISO timestamp as a date ("28 Nov 2026"), or '' when it does not parse. */
export function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? '' : dateFormat.format(date);
}

/** A date in a <time> element, rendered the same on the server and in the browser. */
export function DateText({ iso, className }: { iso: string; className?: string }) {
  return (
    <time dateTime={iso} className={className}>
      {formatDate(iso)}
    </time>
  );
}
