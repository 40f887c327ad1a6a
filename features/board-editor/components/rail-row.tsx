'use client';

import { useDroppable } from '@dnd-kit/core';
import { horizontalListSortingStrategy, SortableContext } from '@dnd-kit/sortable';

import { memo } from 'react';

import { cn } from '@/lib/cn';
import type { RailDrawing } from '@/lib/boards/rail';

import { useBoardView } from '../hooks/use-board-view';
import { DeviceCell } from './device-cell';
import { RailLegend } from './rail-legend';

/** Widest a module is drawn, px: a short rail does not stretch across the page. */
const MAX_MODULE_PX = 58;

/** One rail as drawn, and the part of each RCD's bracket on it (its ends in modules, the ways it protects). */
export type RailView = {
  drawing: RailDrawing;
  brackets: { id: string; from: number; to: number; rcdMa: number | null; protectedLabels: string[] }[];
};

type RailRowProps = { view: RailView; railCount: number };

function FreeModules({ rail, start, modules }: { rail: number; start: number; modules: number }) {
  const { readOnly, dropRefusal: refusal } = useBoardView();
  const { setNodeRef, isOver } = useDroppable({ id: `free:${rail}`, data: { to: 'free', rail }, disabled: readOnly });
  const full = modules <= 0;
  return (
    <div
      ref={setNodeRef}
      data-free-rail={rail}
      style={full ? undefined : { gridColumn: `${start + 1} / span ${modules}`, gridRow: 1 }}
      className={cn(
        'z-0 flex items-center justify-center rounded-sm border-2 border-dashed text-center text-[11px] text-ink-soft',
        full ? 'mt-2 h-9 w-full' : 'm-0.5 self-stretch',
        isOver && !refusal && 'border-copper bg-copper-light/70 text-ink',
        isOver && refusal && 'border-verdict-fail bg-verdict-fail-bg text-verdict-fail',
        !isOver && 'border-line-strong/70 bg-white/30',
      )}
    >
      <span className="px-0.5 leading-tight break-words">
        {isOver && refusal
          ? 'Does not fit'
          : full
            ? `Rail ${rail + 1} is full`
            : `${modules} free module${modules === 1 ? '' : 's'}`}
      </span>
    </div>
  );
}

/**
 * One DIN rail drawn to scale: module grid, RCD brackets, devices, phase gaps and free modules.
 * Drawn again only when its view changes (the devices and the legend follow their own ways).
 */
export const RailRow = memo(function RailRow({ view: { drawing, brackets }, railCount }: RailRowProps) {
  const { readOnly } = useBoardView();
  const columns = Math.max(drawing.capacity, drawing.used);
  const grid = { gridTemplateColumns: `repeat(${columns}, minmax(0, 1fr))` };
  const devices = drawing.cells.flatMap((c) => (c.type === 'device' ? [c] : []));
  const ids = devices.map((c) => c.id);

  return (
    <div className="mb-4 last:mb-0" data-rail={drawing.rail}>
      <div className="mb-1 flex items-baseline justify-between text-[11px] text-ink-soft">
        <span className="font-semibold text-ink">{railCount > 1 ? `Rail ${drawing.rail + 1}` : 'Rail'}</span>
        <span>
          {drawing.used} of {drawing.capacity} modules used
          {drawing.free < 0 ? <strong className="ml-1 text-verdict-fail">· over-full by {-drawing.free}</strong> : null}
        </span>
      </div>
      <div style={{ maxWidth: columns * MAX_MODULE_PX }}>
        {/* RCD brackets over the ways each RCD protects */}
        <div className="grid h-7" style={grid} aria-hidden>
          {brackets.map((b) => (
            <div
              key={b.id}
              style={{ gridColumn: `${b.from + 1} / ${b.to + 1}`, gridRow: 1 }}
              className="relative mx-px mt-3 rounded-t-sm border-x-2 border-t-2 border-copper"
            >
              <span className="absolute -top-3 left-1 max-w-full truncate bg-[#e6e2d8] px-1 text-[10px] font-semibold text-copper-dark">
                RCD {b.rcdMa ?? '?'} mA
                {b.protectedLabels.length ? ` · ${b.protectedLabels.join(', ')}` : ' · nothing yet'}
              </span>
            </div>
          ))}
        </div>
        <SortableContext id={`rail-${drawing.rail}`} items={ids} strategy={horizontalListSortingStrategy}>
          <div className="relative grid min-h-[150px] rounded-sm" style={grid}>
            {/* The rail itself, with a tick at each module */}
            <div
              aria-hidden
              className="pointer-events-none absolute inset-x-0 top-[60px] h-[64px] rounded-[2px] bg-rail"
              style={{
                backgroundImage:
                  'linear-gradient(to right, rgba(255,255,255,0.35) 1px, transparent 1px), linear-gradient(to bottom, transparent 44%, rgba(0,0,0,0.18) 44%, rgba(0,0,0,0.18) 56%, transparent 56%)',
                backgroundSize: `calc(100% / ${columns}) 100%, 100% 100%`,
              }}
            />
            {drawing.cells.map((cell) =>
              cell.type === 'gap' ? (
                <div
                  key={`gap-${cell.beforeId}`}
                  title="Phase positions left empty so that the three-pole device after them starts on L1"
                  style={{ gridColumn: `${cell.start + 1} / span ${cell.modules}`, gridRow: 1 }}
                  className="z-0 m-0.5 mt-[22px] h-[100px] rounded-sm border border-dashed border-ink-faint bg-[repeating-linear-gradient(45deg,transparent,transparent_4px,rgba(31,42,55,0.12)_4px,rgba(31,42,55,0.12)_6px)]"
                >
                  <span className="sr-only">{cell.modules} phase positions left empty</span>
                </div>
              ) : (
                <DeviceCell key={cell.id} wayId={cell.id} label={cell.label} start={cell.start} />
              ),
            )}
            {drawing.free > 0 ? <FreeModules rail={drawing.rail} start={drawing.used} modules={drawing.free} /> : null}
          </div>
        </SortableContext>
        {drawing.free <= 0 && !readOnly ? <FreeModules rail={drawing.rail} start={0} modules={0} /> : null}
      </div>
      <RailLegend railName={railCount > 1 ? `rail ${drawing.rail + 1}` : 'the rail'} entries={devices} />
    </div>
  );
});
