import { CircleCheck, CircleX, Loader2, TriangleAlert, type LucideIcon } from 'lucide-react';

import { cn } from '@/lib/cn';
import { VERDICT_WORDS } from '@/lib/names';
import type { Verdict } from '@/lib/sizing';

/**
 * The one look of each verdict, everywhere a verdict is shown (editor, review, quick size):
 * a tick in a circle for passes, a triangle for near limit, a cross in a circle for fails,
 * each in its own colour of the theme.
 */
export const VERDICT_LOOKS: Record<Verdict, { icon: LucideIcon; tone: string; text: string }> = {
  passes: {
    icon: CircleCheck,
    tone: 'border-verdict-pass/40 bg-verdict-pass-bg text-verdict-pass',
    text: 'text-verdict-pass',
  },
  'near-limit': {
    icon: TriangleAlert,
    tone: 'border-verdict-near/40 bg-verdict-near-bg text-verdict-near',
    text: 'text-verdict-near',
  },
  fails: {
    icon: CircleX,
    tone: 'border-verdict-fail/40 bg-verdict-fail-bg text-verdict-fail',
    text: 'text-verdict-fail',
  },
};

type VerdictBadgeProps = {
  verdict: Verdict;
  className?: string;
  /** Icon and colour only, for a drawn device too narrow for the word (the word is beside it elsewhere). */
  iconOnly?: boolean;
  /** A newer sizing is on its way: a spinner in place of the icon. */
  pending?: boolean;
};

/** A verdict by icon, colour and word together, never colour alone. */
export function VerdictBadge({ verdict, className, iconOnly, pending }: VerdictBadgeProps) {
  const { icon: Icon, tone } = VERDICT_LOOKS[verdict];
  return (
    <span
      data-verdict={verdict}
      className={cn(
        'inline-flex shrink-0 items-center gap-1 rounded-full border text-xs leading-none font-semibold whitespace-nowrap',
        iconOnly ? 'p-0.5' : 'px-2 py-1',
        tone,
        className,
      )}
    >
      {pending ? (
        <Loader2 aria-hidden className="h-3.5 w-3.5 shrink-0 animate-spin" />
      ) : (
        <Icon aria-hidden className="h-3.5 w-3.5 shrink-0" />
      )}
      {iconOnly ? null : VERDICT_WORDS[verdict]}
    </span>
  );
}
