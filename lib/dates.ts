/**
 * The one way the app writes a moment on screen: "2 Dec 2026, 14:05" (day, short month,
 * year, 24-hour time), in the reader's time zone. Lists, the outbox, the change history,
 * review comments and the label walk all write dates through here.
 */
const DATE_TIME = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** "2 Dec 2026, 14:05", or null when the input is not a date. */
export function formatDateTime(value: string | Date | null | undefined): string | null {
  const date = value instanceof Date ? value : value ? new Date(value) : null;
  if (!date || Number.isNaN(date.getTime())) return null;
  return DATE_TIME.format(date);
}
