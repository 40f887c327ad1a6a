import { CircleCheck, CircleHelp, CircleSlash, CircleX, type LucideIcon } from 'lucide-react';

import { cn } from '@/lib/cn';
import type { LabelStatus } from '@/lib/domain';
import { LABEL_STATUS_NAMES } from '@/lib/names';

/**
 * The one look of each label state, on the walk, the board's label findings and the
 * schedule's print view: matches in the passing colour, wrong and missing both in the failing
 * colour (a label that differs from the schedule is a defect either way), told apart by icon.
 */
export const LABEL_STATE_LOOKS: Record<LabelStatus, { icon: LucideIcon; tone: string; text: string }> = {
  unchecked: { icon: CircleHelp, tone: 'border-line-strong bg-paper-sunk text-ink-soft', text: 'text-ink-soft' },
  matches: {
    icon: CircleCheck,
    tone: 'border-verdict-pass/40 bg-verdict-pass-bg text-verdict-pass',
    text: 'text-verdict-pass',
  },
  wrong: {
    icon: CircleX,
    tone: 'border-verdict-fail/40 bg-verdict-fail-bg text-verdict-fail',
    text: 'text-verdict-fail',
  },
  missing: {
    icon: CircleSlash,
    tone: 'border-verdict-fail/40 bg-verdict-fail-bg text-verdict-fail',
    text: 'text-verdict-fail',
  },
};

/** A way's label state by icon, colour and word. */
export function LabelStateBadge({ status, className }: { status: LabelStatus; className?: string }) {
  const { icon: Icon, tone } = LABEL_STATE_LOOKS[status];
  return (
    <span
      data-label-state={status}
      className={cn(
        'inline-flex items-center gap-1 rounded-full border px-2 py-1 text-xs leading-none font-semibold whitespace-nowrap',
        tone,
        className,
      )}
    >
      <Icon aria-hidden className="h-4 w-4 shrink-0" />
      {LABEL_STATUS_NAMES[status]}
    </span>
  );
}
