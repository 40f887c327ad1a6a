'use client';

import { useMemo } from 'react';

import { drawRails, railCapacities } from '@/lib/boards/rail';

import { useDraftSizing } from '../hooks/use-live-sizing';
import { BoardViewContext } from '../hooks/use-board-view';
import { useBoardDraftStore } from '../stores/board-draft-store';
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
  const editSeq = useBoardDraftStore((s) => s.editSeq);
  const sizedFor = useDraftSizing((s) => s.editSeq) ?? 0;
  const rails = useMemo(
    () => (settings ? drawRails(settings.phases, railCapacities(settings.enclosureModules, settings.rails), ways) : []),
    [settings, ways],
  );
  const view = useMemo(
    () => ({
      readOnly,
      showVerdicts,
      dropRefusal,
      onRemove: onRemove ?? ((id: string) => useBoardDraftStore.getState().removeWay(id)),
    }),
    [readOnly, showVerdicts, dropRefusal, onRemove],
  );

  if (!settings) return null;
  const used = rails.reduce((n, r) => n + r.used, 0);
  return (
    <section
      aria-label="Drawn board"
      data-testid="drawn-board"
      data-sized-for={sizedFor}
      data-edit-seq={editSeq}
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
      <BoardViewContext.Provider value={view}>
        {rails.map((drawing) => (
          <RailRow key={drawing.rail} drawing={drawing} railCount={rails.length} />
        ))}
      </BoardViewContext.Provider>
    </section>
  );
}
