'use client';

import { CircleDashed, Plus, Trash2 } from 'lucide-react';
import { memo } from 'react';

import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { rcdGroups } from '@/lib/boards/rail';
import { isProtectiveDevice } from '@/lib/sizing';

import { useWayLabels } from '../hooks/use-board-view';
import { useDraftSizing, useSizingState } from '../hooks/use-live-sizing';
import { useBoardDraftStore } from '../stores/board-draft-store';
import { startingCircuit } from '../utils/default-circuit';
import { deviceWords } from '../utils/device-catalogue';
import { CircuitForm } from './circuit-form';
import { DeviceForm } from './device-form';
import { SizingResult } from './sizing-result';

type WayPanelProps = { readOnly: boolean; showSizing: boolean; onRemove: (id: string) => void };

/** The way's full sizing: drawn again for an answer or a pending state, without the forms above it. */
function WaySizing({ wayId }: { wayId: string }) {
  const result = useDraftSizing((s) => s.result.ways.find((w) => w.id === wayId)?.result);
  const sizedFor = useDraftSizing((s) => s.editSeq) ?? 0;
  const { pending } = useSizingState();
  if (!result) {
    return (
      <p className="text-sm text-ink-soft" role="status">
        Sizing…
      </p>
    );
  }
  return <SizingResult result={result} stale={pending || sizedFor === 0} />;
}

/** The selected way's device, circuit and sizing; several selected (from the summary): a list to step through. */
export const WayPanel = memo(function WayPanel({ readOnly, showSizing, onRemove }: WayPanelProps) {
  const settings = useBoardDraftStore((s) => s.settings);
  const ways = useBoardDraftStore((s) => s.ways);
  const selection = useBoardDraftStore((s) => s.selection);
  const { select, selectMany, updateCircuit } = useBoardDraftStore.getState();
  const labels = useWayLabels();
  const way = ways.find((w) => w.id === selection[0]);

  if (!settings) return null;
  if (!way) {
    return (
      <section aria-label="Way panel" className="rounded-card border border-line bg-paper-raised p-4">
        <h2 className="text-sm font-semibold text-ink">Way panel</h2>
        <p className="mt-2 text-sm text-ink-soft">
          Select a device on the board (click it, or Tab to it and press Enter) to see its circuit and its sizing here.
        </p>
        <Caution className="mt-4" />
      </section>
    );
  }

  const label = labels.get(way.id) ?? null;
  const protective = isProtectiveDevice(way.device.kind);
  const groups = rcdGroups(ways);
  const coveredBy = groups.find((g) => g.protectedIds.includes(way.id));
  const covers = groups.find((g) => g.rcdId === way.id);
  const title = label ? `Way ${label}` : deviceWords(way.device);

  return (
    <section aria-label="Way panel" className="rounded-card border border-line bg-paper-raised" data-panel-way={way.id}>
      {selection.length > 1 ? (
        <div className="border-b border-line bg-paper-sunk/60 px-4 py-2 text-xs text-ink-soft">
          {selection.length} ways selected:
          <span className="ml-1 inline-flex flex-wrap gap-1">
            {selection.map((id) => (
              <button
                key={id}
                type="button"
                onClick={() => selectMany([id, ...selection.filter((s) => s !== id)])}
                className="rounded border border-line-strong bg-paper-raised px-1.5 font-mono text-[11px] text-ink hover:border-copper"
                aria-current={id === way.id}
              >
                {labels.get(id) ?? '–'}
              </button>
            ))}
          </span>
        </div>
      ) : null}
      <div className="flex items-start justify-between gap-2 border-b border-line px-4 py-3">
        <div className="min-w-0">
          <h2 className="text-base font-semibold text-ink">{title}</h2>
          <p className="truncate text-xs text-ink-soft">
            {deviceWords(way.device)}
            {way.circuit?.serves ? ` · ${way.circuit.serves}` : ''}
          </p>
          {protective && way.device.kind !== 'rcbo' ? (
            <p className="text-xs text-ink-faint">
              {coveredBy
                ? `RCD protection from the ${ways.find((w) => w.id === coveredBy.rcdId)?.device.rcdMa ?? '?'} mA RCD before it.`
                : 'No RCD before it on the rail.'}
            </p>
          ) : null}
          {covers ? (
            <p className="text-xs text-ink-faint">
              Protects{' '}
              {covers.protectedIds.length ? covers.protectedIds.map((id) => labels.get(id)).join(', ') : 'no ways yet'}.
            </p>
          ) : null}
        </div>
        {!readOnly ? (
          <Button variant="quiet" size="sm" onClick={() => onRemove(way.id)} aria-label={`Remove ${title}`}>
            <Trash2 aria-hidden className="h-4 w-4" /> Remove
          </Button>
        ) : null}
      </div>

      <div className="space-y-5 px-4 py-4">
        <div>
          <h3 className="mb-2 text-xs font-semibold tracking-wide text-ink-soft uppercase">Device</h3>
          <DeviceForm key={`d-${way.id}`} wayId={way.id} readOnly={readOnly} />
        </div>

        {protective ? (
          <div>
            <div className="mb-2 flex items-center justify-between">
              <h3 className="text-xs font-semibold tracking-wide text-ink-soft uppercase">Circuit</h3>
              {way.circuit && !readOnly ? (
                <Button variant="quiet" size="sm" onClick={() => updateCircuit(way.id, null)}>
                  <CircleDashed aria-hidden className="h-4 w-4" /> Make it a spare
                </Button>
              ) : null}
            </div>
            {way.circuit ? (
              <CircuitForm key={`c-${way.id}`} wayId={way.id} boardPhases={settings.phases} readOnly={readOnly} />
            ) : (
              <div className="rounded-md border border-dashed border-line-strong p-3 text-sm text-ink-soft">
                A spare way: no circuit yet.
                {!readOnly ? (
                  <Button
                    size="sm"
                    className="mt-2 flex"
                    onClick={() => {
                      updateCircuit(way.id, startingCircuit(way.device, settings.phases));
                      select(way.id);
                    }}
                  >
                    <Plus aria-hidden className="h-4 w-4" /> Add a circuit
                  </Button>
                ) : null}
              </div>
            )}
          </div>
        ) : null}

        {protective && way.circuit && showSizing ? <WaySizing wayId={way.id} /> : null}
        {protective && way.circuit && !showSizing ? (
          <p className="text-sm text-ink-soft">Sizing results are shown to designers and inspectors.</p>
        ) : null}
      </div>
    </section>
  );
});
