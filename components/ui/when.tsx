const dateFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
});
const fullFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeStyle: 'short' });

/** A date as the day it happened, with the full time on hover. Unparseable input shows a dash. */
export function When({ iso }: { iso: string | null | undefined }) {
  const date = iso ? new Date(iso) : null;
  if (!date || Number.isNaN(date.getTime())) return <span className="text-ink-faint">—</span>;
  // The server and the browser may sit in different time zones; the browser's reading wins
  return (
    <time dateTime={date.toISOString()} title={fullFormat.format(date)} suppressHydrationWarning>
      {dateFormat.format(date)}
    </time>
  );
}
