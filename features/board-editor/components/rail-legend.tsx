'use client';

import { memo } from 'react';

import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { cn } from '@/lib/cn';
import { isProtectiveDevice } from '@/lib/sizing';

import { useBoardView } from '../hooks/use-board-view';
import { useDraftSizing } from '../hooks/use-live-sizing';
import { useBoardDraftStore } from '../stores/board-draft-store';
import { deviceWords } from '../utils/device-catalogue';
import { PENDING_DIM } from './device-cell';

type RailLegendProps = {
  /** "the rail" or "rail 2", for the list's name. */
  railName: string;
  /** The devices on the rail in rail order, with their way references. */
  entries: { id: string; label: string | null }[];
};

/**
 * The rail's legend, under the drawing: every device on the rail by its way reference, with
 * the device, what it serves and its verdict in words, read without turning the head however
 * narrow the device is drawn. A click picks the way, as a click on the rail does (the rail's
 * devices are the keyboard's way to pick one, so the legend adds no tab stops).
 */
export const RailLegend = memo(function RailLegend({ railName, entries }: RailLegendProps) {
  if (!entries.length) return null;
  return (
    <ol
      aria-label={`Ways on ${railName}`}
      className="mt-2 gap-x-4 border-t border-ink/15 pt-2 sm:columns-2 2xl:columns-3"
    >
      {entries.map(({ id, label }) => (
        <LegendEntry key={id} wayId={id} label={label} />
      ))}
    </ol>
  );
});

/** One way in the legend: drawn again only when its way, its selection or its verdict changes. */
const LegendEntry = memo(function LegendEntry({ wayId, label }: { wayId: string; label: string | null }) {
  const way = useBoardDraftStore((s) => s.ways.find((w) => w.id === wayId))!;
  const selected = useBoardDraftStore((s) => s.selection.includes(wayId));
  const onSelect = useBoardDraftStore((s) => s.select);
  const { showVerdicts } = useBoardView();
  const verdict = useDraftSizing((s) => s.result.ways.find((w) => w.id === wayId)?.result?.verdict);
  const spare = (isProtectiveDevice(way.device.kind) && !way.circuit) || way.device.kind === 'blank';
  return (
    <li
      data-legend-way={way.id}
      onClick={() => onSelect(way.id)}
      className={cn(
        // Read down each column, then across; an entry never splits between columns
        'mb-0.5 flex cursor-pointer break-inside-avoid items-start gap-2 rounded-md px-1.5 py-1 text-xs leading-snug hover:bg-white/60',
        selected && 'bg-copper-light ring-1 ring-copper',
      )}
    >
      <span className="w-14 shrink-0 font-mono font-semibold text-ink">
        {label ? <span className="sr-only">Way </span> : null}
        {label ?? '–'}
      </span>
      <span className="min-w-0 flex-1 break-words">
        <span className="font-medium text-ink">{deviceWords(way.device)}</span>
        {way.circuit?.serves ? <span className="text-ink-soft">: {way.circuit.serves}</span> : null}
        {spare ? <span className="text-ink-soft">: spare</span> : null}
      </span>
      {showVerdicts && verdict ? <VerdictBadge verdict={verdict} className={cn('px-1.5 py-0.5', PENDING_DIM)} /> : null}
    </li>
  );
});
