import { Check as CheckIcon, X } from 'lucide-react';

import { Caution } from '@/components/ui/caution';
import { cn } from '@/lib/cn';
import { vdLimitText } from '@/lib/names';
import type { CircuitResult } from '@/lib/sizing';

import { VerdictBadge } from './verdict-badge';

/** Rounds for display only; the engine never rounds. */
export function fmt(value: number | null | undefined, digits = 2, unit = ''): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  return `${value.toFixed(digits)}${unit ? ` ${unit}` : ''}`;
}

function Row({ label, value, hint }: { label: string; value: string; hint?: string }) {
  return (
    <div className="flex items-baseline justify-between gap-4 border-b border-line/60 py-1.5 last:border-0">
      <dt className="text-sm text-ink-soft">
        {label}
        {hint ? <span className="ml-1 text-xs text-ink-faint">{hint}</span> : null}
      </dt>
      <dd className="font-mono text-sm text-ink tabular-nums">{value}</dd>
    </div>
  );
}

function Step({ n, title, children }: { n: number; title: string; children: React.ReactNode }) {
  return (
    <section className="rounded-md border border-line bg-paper-raised p-3">
      <h4 className="mb-1 flex items-center gap-2 text-xs font-semibold tracking-wide text-ink-soft uppercase">
        <span className="grid h-5 w-5 place-items-center rounded-full bg-ink text-[10px] text-paper">{n}</span>
        {title}
      </h4>
      <dl>{children}</dl>
    </section>
  );
}

/**
 * One circuit's sizing laid out step by step: design current and device, correction
 * factors, the table row used, voltage drop, loop impedance and fault checks, then every
 * check with the regulation or table it comes from.
 */
export function CircuitResultView({ result, compact }: { result: CircuitResult; compact?: boolean }) {
  const f = result.factors;
  const product = f.ca === null || f.cg === null ? null : f.ca * f.cg * f.ci * f.cc;
  return (
    <div className="flex flex-col gap-3" data-testid="circuit-result">
      <div className="flex items-center justify-between">
        <h3 className="text-sm font-semibold">Result</h3>
        <VerdictBadge verdict={result.verdict} />
      </div>
      <div className={cn('grid gap-3', compact ? 'grid-cols-1' : 'grid-cols-1 lg:grid-cols-2')}>
        <Step n={1} title="Current and device">
          <Row label="Design current Ib" value={fmt(result.ibA, 1, 'A')} />
          <Row label="Device rating In" value={fmt(result.inA, 0, 'A')} />
          <Row label="Disconnection time required" value={fmt(result.disconnectionTimeS, 1, 's')} />
        </Step>
        <Step n={2} title="Correction factors">
          <Row label="Ca" hint="ambient" value={fmt(f.ca, 3)} />
          <Row label="Cg" hint="grouping" value={fmt(f.cg, 3)} />
          <Row label="Ci" hint="thermal insulation" value={fmt(f.ci, 3)} />
          <Row label="Cc" hint="device / buried" value={fmt(f.cc, 3)} />
          <Row label="All together" value={fmt(product, 3)} />
        </Step>
        <Step n={3} title="Cable">
          <Row label="Tabulated current needed" value={fmt(result.requiredItA, 1, 'A')} />
          <Row
            label="Table row used"
            value={
              result.tableRow
                ? `${result.tableRow.table}, method ${result.tableRow.method}, ${result.tableRow.csaMm2} mm²`
                : '–'
            }
          />
          <Row label="Line / cpc" value={result.csaMm2 ? `${result.csaMm2} / ${result.cpcMm2 ?? '–'} mm²` : '–'} />
          <Row label="It (tabulated)" value={fmt(result.itA, 1, 'A')} />
          <Row label="Iz (after factors)" value={fmt(result.izA, 1, 'A')} />
        </Step>
        <Step n={4} title="Voltage drop">
          <Row label="mV/A/m" value={fmt(result.tableRow?.mvAm, 2)} />
          <Row label="Drop" value={fmt(result.vdV, 2, 'V')} />
          <Row label="Drop / limit" value={`${fmt(result.vdPct, 2, '%')} / ${vdLimitText(result.vdLimitPct)} %`} />
        </Step>
        <Step n={5} title="Earth fault loop">
          <Row label="R1+R2" value={fmt(result.r1r2Ohm, 3, 'Ω')} />
          <Row label="Zs" value={fmt(result.zsOhm, 3, 'Ω')} />
          <Row label="Max Zs" value={fmt(result.zsMaxOhm, 3, 'Ω')} />
        </Step>
        <Step n={6} title="Fault current">
          <Row label="Earth fault current" value={fmt(result.faultCurrentA, 0, 'A')} />
          <Row label="Smallest cpc (adiabatic)" value={fmt(result.cpcMinMm2, 2, 'mm²')} />
        </Step>
      </div>
      <section aria-label="Checks">
        <h4 className="mb-1 text-xs font-semibold tracking-wide text-ink-soft uppercase">Checks</h4>
        <ul className="divide-y divide-line/60 rounded-md border border-line bg-paper-raised">
          {result.checks.map((check) => (
            <li key={check.code} className="flex gap-2 px-3 py-2 text-sm">
              {check.ok ? (
                <CheckIcon aria-label="met" className="mt-0.5 h-4 w-4 shrink-0 text-verdict-pass" />
              ) : (
                <X aria-label="not met" className="mt-0.5 h-4 w-4 shrink-0 text-verdict-fail" />
              )}
              <span className="flex-1">
                {check.message}
                <span className="ml-1 text-xs whitespace-nowrap text-ink-faint">{check.reference}</span>
              </span>
            </li>
          ))}
        </ul>
      </section>
      {result.notes.length ? (
        <ul className="list-disc pl-5 text-xs text-ink-soft">
          {result.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
      <Caution />
    </div>
  );
}
