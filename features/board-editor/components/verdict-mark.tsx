import { CircleCheck, CircleX, Loader2, TriangleAlert } from 'lucide-react';

import { cn } from '@/lib/cn';
import type { Verdict } from '@/lib/sizing';

/** The product's words for each verdict. */
export const VERDICT_WORDS: Record<Verdict, string> = {
  passes: 'Passes',
  'near-limit': 'Near limit',
  fails: 'Fails',
};

const TONES: Record<Verdict, string> = {
  passes: 'bg-verdict-pass-bg text-verdict-pass border-verdict-pass/40',
  'near-limit': 'bg-verdict-near-bg text-verdict-near border-verdict-near/40',
  fails: 'bg-verdict-fail-bg text-verdict-fail border-verdict-fail/40',
};

const ICONS = { passes: CircleCheck, 'near-limit': TriangleAlert, fails: CircleX } as const;

/** A verdict shown as icon, colour and word together (never colour alone). */
export function VerdictMark({
  verdict,
  className,
  vertical,
  pending,
}: {
  verdict: Verdict;
  className?: string;
  /** Word written upwards, for a one-module device. */
  vertical?: boolean;
  /** A newer sizing is on its way. */
  pending?: boolean;
}) {
  const Icon = ICONS[verdict];
  return (
    <span
      data-verdict={verdict}
      className={cn(
        'inline-flex items-center gap-1 rounded border text-[11px] leading-none font-semibold',
        vertical ? 'flex-col px-0.5 py-1' : 'px-1.5 py-1',
        TONES[verdict],
        className,
      )}
    >
      {pending ? (
        <Loader2 aria-hidden className="h-3.5 w-3.5 shrink-0 animate-spin" />
      ) : (
        <Icon aria-hidden className="h-3.5 w-3.5 shrink-0" />
      )}
      <span className={cn(vertical && '[writing-mode:vertical-rl] rotate-180 whitespace-nowrap')}>
        {VERDICT_WORDS[verdict]}
      </span>
    </span>
  );
}
