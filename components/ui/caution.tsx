import { cn } from '@/lib/cn';
import { SIZING_CAUTION } from '@/lib/sizing';

/** The words every sizing screen and printed schedule carries (one text, from the engine). */
export const CAUTION_TEXT = SIZING_CAUTION;

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
