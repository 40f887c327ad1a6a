'use client';

import { replaceEqualDeep } from '@tanstack/react-query';
import { memo, useMemo, useRef } from 'react';

import type { BoardSettings } from '@/lib/boards/schemas';
import { drawRails, railCapacities, rcdGroups } from '@/lib/boards/rail';
import { supplyInUseWords } from '@/lib/sites/supply-words';
import type { DerivedSupply } from '@/lib/sites/tree-types';

import { useDraftSizing, useSizingState } from '../hooks/use-live-sizing';
import { BoardViewContext } from '../hooks/use-board-view';
import { useBoardDraftStore } from '../stores/board-draft-store';
import type { EditorWay } from '../types/draft';
import { RailRow, type RailView } from './rail-row';

type DrawnBoardProps = {
  readOnly: boolean;
  showVerdicts: boolean;
  /** Why the device being dragged would not fit where it is, if it would not. */
  dropRefusal?: string | null;
  onRemove?: (id: string) => void;
  /**
   * What the site's tree sized the board with (the board DTO's `derivedSupply`): when given, the
   * header shows those values, not the board's typed supply, which is then not used.
   */
  derivedSupply?: DerivedSupply | null;
};

/** Each rail as drawn, with the part of each RCD's bracket that lies on it. */
function railViews(settings: BoardSettings, ways: EditorWay[]): RailView[] {
  const drawings = drawRails(settings.phases, railCapacities(settings.enclosureModules, settings.rails), ways);
  const cells = drawings.flatMap((d) => d.cells.flatMap((c) => (c.type === 'device' ? [c] : [])));
  const labels = new Map(cells.map((c) => [c.id, c.label]));
  const groups = rcdGroups(ways);
  return drawings.map((drawing) => {
    const cellOf = new Map(cells.filter((c) => drawing.cells.includes(c)).map((c) => [c.id, c]));
    const brackets = groups.flatMap((g) => {
      const here = g.spanIds.map((id) => cellOf.get(id)).filter((c) => c !== undefined);
      if (!here.length) return [];
      const from = Math.min(...here.map((c) => c.start));
      const to = Math.max(...here.map((c) => c.start + c.modules));
      const rcdMa = ways.find((w) => w.id === g.rcdId)?.device.rcdMa ?? null;
      const protectedLabels = g.protectedIds.flatMap((id) => labels.get(id) ?? []);
      return [{ id: g.rcdId, from, to, rcdMa, protectedLabels }];
    });
    return { drawing, brackets };
  });
}

/**
 * The rails as drawn, kept from the last change where nothing of them changed (a circuit's
 * length, say): a rail whose drawing is the same object is not drawn again (`RailRow` is memoised).
 */
function useRailViews(): RailView[] {
  const last = useRef<RailView[]>([]);
  return useBoardDraftStore((s) => {
    const next = s.settings ? railViews(s.settings, s.ways) : [];
    last.current = replaceEqualDeep(last.current, next);
    return last.current;
  });
}

/** The board as drawn: the enclosure and each rail to scale (`RailRow`). */
export const DrawnBoard = memo(function DrawnBoard(props: DrawnBoardProps) {
  const { readOnly, showVerdicts, dropRefusal = null, onRemove, derivedSupply = null } = props;
  const settings = useBoardDraftStore((s) => s.settings);
  const editSeq = useBoardDraftStore((s) => s.editSeq);
  const sizedFor = useDraftSizing((s) => s.editSeq) ?? 0;
  const { pending } = useSizingState();
  const rails = useRailViews();
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
  const used = rails.reduce((n, r) => n + r.drawing.used, 0);
  const supply = supplyInUseWords(settings.supply, derivedSupply);
  // Whether the verdicts shown are for the draft as it is is said here once, not by every
  // device: the verdicts dim (by CSS, after a moment) while a newer sizing is on its way
  return (
    <section
      aria-label="Drawn board"
      aria-busy={pending || undefined}
      data-testid="drawn-board"
      data-sized-for={sizedFor}
      data-edit-seq={editSeq}
      data-sizing={pending ? 'pending' : 'done'}
      className="group/board rounded-[14px] border-[6px] border-ink/85 bg-[#e6e2d8] p-3 shadow-sm"
    >
      <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2 border-b border-ink/15 pb-2 text-xs text-ink-soft">
        <span className="font-semibold text-ink" title={supply.title} data-testid="drawn-board-supply">
          {settings.phases === 3 ? 'Three-phase' : 'Single-phase'} · {supply.supply.earthing} · {supply.values}
        </span>
        <span>
          Enclosure {settings.enclosureModules} modules · {used} used · incoming {settings.incoming.ratingA} A
        </span>
      </div>
      <BoardViewContext.Provider value={view}>
        {rails.map((view) => (
          <RailRow key={view.drawing.rail} view={view} railCount={rails.length} />
        ))}
      </BoardViewContext.Provider>
    </section>
  );
});
