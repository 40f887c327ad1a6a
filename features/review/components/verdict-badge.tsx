import { CircleCheck, CircleX, TriangleAlert } from 'lucide-react';

import { cn } from '@/lib/cn';
import type { Verdict } from '@/lib/sizing';

const looks: Record<Verdict, { word: string; icon: typeof CircleCheck; tone: string }> = {
  passes: { word: 'Passes', icon: CircleCheck, tone: 'text-verdict-pass bg-verdict-pass-bg' },
  'near-limit': { word: 'Near limit', icon: TriangleAlert, tone: 'text-verdict-near bg-verdict-near-bg' },
  fails: { word: 'Fails', icon: CircleX, tone: 'text-verdict-fail bg-verdict-fail-bg' },
};

/** A way's verdict by icon, colour and word. */
export function VerdictBadge({ verdict }: { verdict: Verdict | null }) {
  if (!verdict) return <span className="text-xs text-ink-faint">No circuit</span>;
  const { word, icon: Icon, tone } = looks[verdict];
  return (
    <span className={cn('inline-flex items-center gap-1 rounded-full px-2 py-0.5 text-xs font-medium', tone)}>
      <Icon aria-hidden className="h-3.5 w-3.5" />
      {word}
    </span>
  );
}
