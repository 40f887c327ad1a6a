import { cn } from '@/lib/cn';
import type { BoardStatus } from '@/lib/domain';
import { BOARD_STATUS_NAMES } from '@/lib/names';

const tones: Record<BoardStatus, string> = {
  draft: 'border-line-strong bg-paper-sunk text-ink-soft',
  'in-review': 'border-copper/50 bg-copper-light text-copper-dark',
  issued: 'border-ink/30 bg-ink/5 text-ink',
  'labels-matched': 'border-verdict-pass/40 bg-verdict-pass-bg text-verdict-pass',
};

/** A board's lifecycle stage, in words. */
export function StatusBadge({ status }: { status: BoardStatus }) {
  return (
    <span className={cn('inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-medium', tones[status])}>
      {BOARD_STATUS_NAMES[status]}
    </span>
  );
}

/** Marks an archived site or board: out of the lists, read-only, kept whole. */
export function ArchivedBadge() {
  return (
    <span className="inline-flex items-center rounded-full border border-dashed border-ink/40 bg-paper-sunk px-2 py-0.5 text-xs font-medium text-ink-soft">
      Archived
    </span>
  );
}
