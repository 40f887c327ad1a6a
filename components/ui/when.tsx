import { formatDateTime } from '@/lib/dates';

/** A moment in the app's one date-and-time format (`lib/dates.ts`). Unparseable input shows a dash. */
export function When({ iso, className }: { iso: string | null | undefined; className?: string }) {
  const text = formatDateTime(iso);
  if (!iso || !text) return <span className="text-ink-faint">—</span>;
  // The server and the browser may sit in different time zones; the browser's reading wins
  return (
    <time dateTime={new Date(iso).toISOString()} className={className} suppressHydrationWarning>
      {text}
    </time>
  );
}
