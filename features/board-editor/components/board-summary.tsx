'use client';

import { CircleCheck, CircleX, TriangleAlert } from 'lucide-react';
import { memo } from 'react';

import { fmt } from '@/components/sizing/circuit-result-view';
import { countWays, countWords } from '@/lib/boards/counts';
import { cn } from '@/lib/cn';

import { useDraftSizing, useSizingError } from '../hooks/use-live-sizing';
import { useBoardDraftStore } from '../stores/board-draft-store';

function Stat({ title, children, className }: { title: string; children: React.ReactNode; className?: string }) {
  return (
    <div className={cn('rounded-md border border-line bg-paper px-3 py-2', className)}>
      <div className="text-[11px] font-semibold tracking-wide text-ink-soft uppercase">{title}</div>
      <div className="mt-0.5 text-sm text-ink">{children}</div>
    </div>
  );
}

function CheckLine({ ok, message }: { ok: boolean; message: string }) {
  const Icon = ok ? CircleCheck : CircleX;
  return (
    <span className={cn('flex items-start gap-1', ok ? 'text-ink' : 'text-verdict-fail')}>
      <Icon aria-hidden className={cn('mt-0.5 h-3.5 w-3.5 shrink-0', ok ? 'text-verdict-pass' : 'text-verdict-fail')} />
      <span>
        <span className="sr-only">{ok ? 'Met: ' : 'Not met: '}</span>
        {message}
      </span>
    </span>
  );
}

/** The board summary: the board's own figures and checks; a count of failing or near ways selects them. */
export const BoardSummary = memo(function BoardSummary() {
  const result = useDraftSizing((s) => s.result);
  const error = useSizingError();
  const selectMany = useBoardDraftStore((s) => s.selectMany);
  // The words only: a change to a circuit does not draw the summary again
  const wayCounts = useBoardDraftStore((s) => countWords(countWays(s.settings?.phases ?? 1, s.ways)));
  if (!result) {
    return (
      <section
        aria-label="Board summary"
        className="rounded-card border border-line bg-paper-raised p-3 text-sm text-ink-soft"
      >
        {error ? <span className="text-verdict-fail">Sizing failed: {error}</span> : 'Sizing the board…'}
      </section>
    );
  }
  const s = result.summary;
  const ids = (verdict: 'fails' | 'near-limit') =>
    result.ways.filter((w) => w.result?.verdict === verdict).map((w) => w.id);
  const failing = ids('fails');
  const near = ids('near-limit');
  const phaseCurrents = s.phaseCurrentsA;
  // Failing board checks other than those shown in their own boxes above
  const otherFailing = s.checks.filter((c) => !c.ok && !['incoming', 'busbar', 'modules'].includes(c.code));
  return (
    <section aria-label="Board summary" className="rounded-card border border-line bg-paper-raised p-3">
      <div className="mb-2 flex items-baseline justify-between">
        <h2 className="text-sm font-semibold text-ink">Board summary</h2>
        {error ? <span className="text-xs text-verdict-fail">Last sizing failed: {error}</span> : null}
      </div>
      <div className="grid grid-cols-2 gap-2 lg:grid-cols-4">
        <Stat title="Maximum demand">
          <span className="text-lg font-semibold tabular-nums">{fmt(s.maxDemandA, 1)} A</span>
          <span className="block text-xs text-ink-soft">
            connected {fmt(s.connectedLoadW / 1000, 1)} kW, after diversity
          </span>
        </Stat>
        <Stat title={phaseCurrents ? 'Per phase' : 'Supply'}>
          {phaseCurrents ? (
            <>
              <span className="block tabular-nums">
                L1 {fmt(phaseCurrents.L1, 1)} · L2 {fmt(phaseCurrents.L2, 1)} · L3 {fmt(phaseCurrents.L3, 1)} A
              </span>
              <span className="block text-xs text-ink-soft">imbalance {fmt(s.imbalancePct, 0)} %</span>
            </>
          ) : (
            <span className="block text-xs text-ink-soft">Single-phase: all on L1</span>
          )}
        </Stat>
        <Stat title="Incoming device">
          <CheckLine ok={s.incomingCheck.ok} message={s.incomingCheck.message} />
          {s.busbarCheck ? <CheckLine ok={s.busbarCheck.ok} message={s.busbarCheck.message} /> : null}
        </Stat>
        <Stat title="Modules">
          <CheckLine
            ok={s.modulesCheck.ok}
            message={`${s.modulesUsed} of ${s.enclosureModules} used, ${s.modulesFree} free`}
          />
        </Stat>
      </div>
      <div className="mt-2 flex flex-wrap items-center gap-2 text-sm" role="group" aria-label="Ways by verdict">
        <button
          type="button"
          disabled={!failing.length}
          onClick={() => selectMany(failing)}
          className="inline-flex items-center gap-1.5 rounded-md border border-verdict-fail/40 bg-verdict-fail-bg px-2.5 py-1 font-medium text-verdict-fail enabled:hover:border-verdict-fail disabled:opacity-60"
        >
          <CircleX aria-hidden className="h-4 w-4" /> {s.counts.fails}{' '}
          {s.counts.fails === 1 ? 'way fails' : 'ways fail'}
        </button>
        <button
          type="button"
          disabled={!near.length}
          onClick={() => selectMany(near)}
          className="inline-flex items-center gap-1.5 rounded-md border border-verdict-near/40 bg-verdict-near-bg px-2.5 py-1 font-medium text-verdict-near enabled:hover:border-verdict-near disabled:opacity-60"
        >
          <TriangleAlert aria-hidden className="h-4 w-4" /> {s.counts.nearLimit} near the limit
        </button>
        <span className="inline-flex items-center gap-1.5 rounded-md border border-verdict-pass/40 bg-verdict-pass-bg px-2.5 py-1 font-medium text-verdict-pass">
          <CircleCheck aria-hidden className="h-4 w-4" /> {s.counts.passes} pass
        </span>
        {/* The ways counted by way number, in the words of the boards list and the schedule */}
        <span className="text-ink-soft" data-testid="way-counts">
          · {wayCounts}
        </span>
      </div>
      {otherFailing.length ? (
        <ul className="mt-2 space-y-1 text-xs">
          {otherFailing.map((c, i) => (
            <li key={`${c.code}-${i}`}>
              <CheckLine ok={false} message={`${c.message} (${c.reference})`} />
            </li>
          ))}
        </ul>
      ) : null}
      <details className="mt-2 text-xs text-ink-soft">
        <summary className="cursor-pointer">Diversity used</summary>
        <ul className="mt-1 list-disc space-y-0.5 pl-5">
          {s.diversityRules.map((r, i) => (
            <li key={i}>
              {r.rule} <span className="text-ink-faint">({r.source})</span>
            </li>
          ))}
        </ul>
      </details>
    </section>
  );
});
