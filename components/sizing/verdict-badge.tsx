import { CircleAlert, CircleCheck, CircleX } from 'lucide-react';

import { cn } from '@/lib/cn';
import { VERDICT_WORDS } from '@/lib/names';
import type { Verdict } from '@/lib/sizing';

const tone: Record<Verdict, string> = {
  passes: 'border-verdict-pass/40 bg-verdict-pass-bg text-verdict-pass',
  'near-limit': 'border-verdict-near/40 bg-verdict-near-bg text-verdict-near',
  fails: 'border-verdict-fail/40 bg-verdict-fail-bg text-verdict-fail',
};

const Icon = { passes: CircleCheck, 'near-limit': CircleAlert, fails: CircleX } as const;

/** A verdict by icon, colour and word together, never colour alone. */
export function VerdictBadge({ verdict, className }: { verdict: Verdict; className?: string }) {
  const I = Icon[verdict];
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs font-semibold',
        tone[verdict],
        className,
      )}
    >
      <I aria-hidden className="h-3.5 w-3.5" />
      {VERDICT_WORDS[verdict]}
    </span>
  );
}
