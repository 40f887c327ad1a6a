import { CircleCheck, CircleX } from 'lucide-react';

import { fmt } from '@/components/sizing/circuit-result-view';
import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { Caution } from '@/components/ui/caution';
import { cn } from '@/lib/cn';
import { vdLimitText } from '@/lib/names';
import type { CircuitResult } from '@/lib/sizing';

function Row({ name, value, note }: { name: React.ReactNode; value: React.ReactNode; note?: React.ReactNode }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-b border-line/70 py-1 last:border-0">
      <dt className="text-ink-soft">{name}</dt>
      <dd className="text-right font-medium text-ink tabular-nums">
        {value}
        {note ? <span className="ml-1 text-xs font-normal text-ink-faint">{note}</span> : null}
      </dd>
    </div>
  );
}

/** The whole sizing of one way: its figures, factors, every check with its reference, and the caution. */
export function SizingResult({ result, stale }: { result: CircuitResult; stale?: boolean }) {
  const f = result.factors;
  const failed = result.checks.filter((c) => !c.ok).length;
  return (
    <section
      aria-label="Sizing result"
      className={cn('space-y-3', stale && 'opacity-70')}
      aria-busy={stale || undefined}
    >
      <div className="flex items-center justify-between gap-2">
        <h3 className="text-sm font-semibold text-ink">Sizing</h3>
        <VerdictBadge verdict={result.verdict} pending={stale} />
      </div>
      <p className="text-xs text-ink-soft">
        {failed ? `${failed} of ${result.checks.length} checks fail.` : `All ${result.checks.length} checks pass.`}
      </p>
      <dl className="text-sm">
        <Row name="Design current Ib" value={fmt(result.ibA, 2, 'A')} />
        <Row name="Device In" value={result.inA === null ? '–' : `${result.inA} A`} />
        <Row name="Required It" value={fmt(result.requiredItA, 2, 'A')} note="In ÷ factors" />
        <Row
          name="Cable"
          value={result.csaMm2 === null ? '–' : `${result.csaMm2} mm²`}
          note={result.cpcMm2 ? `cpc ${result.cpcMm2} mm²` : undefined}
        />
        <Row
          name="Tabulated It"
          value={fmt(result.itA, 1, 'A')}
          note={
            result.tableRow
              ? `${result.tableRow.table.replace(/^.*?(Tables? \S+).*$/, '$1')}, method ${result.tableRow.method}`
              : undefined
          }
        />
        <Row name="Iz after factors" value={fmt(result.izA, 2, 'A')} />
        <Row
          name="Voltage drop"
          value={`${fmt(result.vdV, 2, 'V')} (${fmt(result.vdPct, 2, '%')})`}
          note={`limit ${vdLimitText(result.vdLimitPct)} %`}
        />
        <Row name="R1+R2" value={fmt(result.r1r2Ohm, 3, 'Ω')} />
        <Row name="Zs" value={fmt(result.zsOhm, 3, 'Ω')} note={`limit ${fmt(result.zsMaxOhm, 2, 'Ω')}`} />
        <Row name="Earth fault current" value={fmt(result.faultCurrentA, 0, 'A')} />
        <Row name="Smallest cpc (adiabatic)" value={fmt(result.cpcMinMm2, 2, 'mm²')} />
        <Row name="Disconnection within" value={`${result.disconnectionTimeS} s`} />
      </dl>
      <div className="grid grid-cols-4 gap-1 text-center text-xs" aria-label="Correction factors" role="group">
        {(
          [
            ['Ca', f.ca, 'ambient'],
            ['Cg', f.cg, 'grouping'],
            ['Ci', f.ci, 'insulation'],
            ['Cc', f.cc, 'fuse or ground'],
          ] as const
        ).map(([name, value, what]) => (
          <div key={name} className="rounded border border-line bg-paper px-1 py-1">
            <div className="font-semibold text-ink">
              {name} {fmt(value, name === 'Cc' ? 3 : 2)}
            </div>
            <div className="text-[10px] text-ink-faint">{what}</div>
          </div>
        ))}
      </div>
      <div>
        <h4 className="mb-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Checks</h4>
        <ul className="space-y-1.5">
          {result.checks.map((c) => (
            <li key={c.code} data-check={c.code} className="flex gap-2 text-sm">
              {c.ok ? (
                <CircleCheck aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-verdict-pass" />
              ) : (
                <CircleX aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-verdict-fail" />
              )}
              <span>
                <span className="sr-only">{c.ok ? 'Met: ' : 'Not met: '}</span>
                <span className={cn(!c.ok && 'font-medium text-verdict-fail')}>{c.message}</span>
                <span className="block text-xs text-ink-faint">{c.reference}</span>
              </span>
            </li>
          ))}
        </ul>
      </div>
      {result.notes.length ? (
        <ul className="list-disc space-y-0.5 pl-5 text-xs text-ink-soft">
          {result.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
      <Caution />
    </section>
  );
}
