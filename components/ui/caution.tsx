import { cn } from '@/lib/cn';

/** The words every sizing screen and printed schedule carries. */
export const CAUTION_TEXT =
  'Boardwright is a design aid. Every result must be checked by a competent person against the current edition of BS 7671 (or the local wiring rules) and the manufacturers’ data. Local codes and licensed practice take precedence.';

/** The safety caution, shown on every sizing screen. */
export function Caution({ className }: { className?: string }) {
  return (
    <aside
      role="note"
      aria-label="Caution"
      className={cn(
        'rounded-md border border-copper/40 bg-copper-light/60 px-3 py-2 text-xs leading-relaxed text-ink',
        className,
      )}
    >
      <strong className="font-semibold">Caution.</strong> {CAUTION_TEXT}
    </aside>
  );
}
