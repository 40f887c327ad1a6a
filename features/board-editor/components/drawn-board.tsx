'use client';

import { useCallback, useMemo } from 'react';

import { layoutWays } from '@/lib/boards/layout';
import { drawRails, railCapacities, rcdGroups } from '@/lib/boards/rail';

import { useBoardDraftStore } from '../stores/board-draft-store';
import { useSizingStore } from '../stores/sizing-store';
import { RailRow } from './rail-row';

type DrawnBoardProps = {
  readOnly: boolean;
  showVerdicts: boolean;
  /** Why the device being dragged would not fit where it is, if it would not. */
  dropRefusal?: string | null;
  onRemove?: (id: string) => void;
};

/**
 * The board as drawn: the enclosure and each rail to scale, every device at its module width
 * with its way reference, what it serves and its verdict, RCD brackets, gaps and free modules.
 */
export function DrawnBoard({ readOnly, showVerdicts, dropRefusal = null, onRemove }: DrawnBoardProps) {
  const settings = useBoardDraftStore((s) => s.settings);
  const ways = useBoardDraftStore((s) => s.ways);
  const selection = useBoardDraftStore((s) => s.selection);
  const select = useBoardDraftStore((s) => s.select);
  const removeWay = useBoardDraftStore((s) => s.removeWay);
  const results = useSizingStore((s) => s.byId);
  const sizedFor = useSizingStore((s) => s.forRevision);
  const revision = useBoardDraftStore((s) => s.revision);
  const pending = useSizingStore((s) => s.pendingRevision !== null);

  const rails = useMemo(
    () =>
      settings ? drawRails(settings.phases, railCapacities(settings.enclosureModules, settings.rails), ways) : [],
    [settings, ways],
  );
  const labels = useMemo(
    () => new Map(settings ? layoutWays(settings.phases, ways).map((p) => [p.id, p.label]) : []),
    [settings, ways],
  );
  const groups = useMemo(() => rcdGroups(ways), [ways]);
  const wayById = useMemo(() => new Map(ways.map((w) => [w.id, w])), [ways]);
  const onSelect = useCallback((id: string) => select(id), [select]);
  const remove = useCallback((id: string) => (onRemove ? onRemove(id) : removeWay(id)), [onRemove, removeWay]);

  if (!settings) return null;
  const used = rails.reduce((n, r) => n + r.used, 0);
  return (
    <section
      aria-label="Drawn board"
      data-testid="drawn-board"
      data-sized-for={sizedFor}
      data-draft-revision={revision}
      className="rounded-[14px] border-[6px] border-ink/85 bg-[#e6e2d8] p-3 shadow-sm"
    >
      <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2 border-b border-ink/15 pb-2 text-xs text-ink-soft">
        <span className="font-semibold text-ink">
          {settings.phases === 3 ? 'Three-phase' : 'Single-phase'} · {settings.supply.earthing} · Ze{' '}
          {settings.supply.zeOhm} Ω · PFC {settings.supply.pfcKa} kA
        </span>
        <span>
          Enclosure {settings.enclosureModules} modules · {used} used · incoming {settings.incoming.ratingA} A
        </span>
      </div>
      {rails.map((drawing) => (
        <RailRow
          key={drawing.rail}
          drawing={drawing}
          railCount={rails.length}
          wayById={wayById}
          groups={groups}
          labels={labels}
          results={results}
          sizedFor={sizedFor}
          pending={pending}
          showVerdicts={showVerdicts}
          selection={selection}
          readOnly={readOnly}
          dropRefusal={dropRefusal}
          onSelect={onSelect}
          onRemove={remove}
        />
      ))}
    </section>
  );
}
