'use client';

import {
  DndContext,
  KeyboardSensor,
  PointerSensor,
  TouchSensor,
  useDraggable,
  useDroppable,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
} from '@dnd-kit/core';
import { GripVertical, PlugZap } from 'lucide-react';
import Link from 'next/link';
import { useId } from 'react';

import { VerdictBadge } from '@/components/sizing/verdict-badge';
import { FeedSelect } from '@/components/site-diagram/feed-select';
import { SelectivityList } from '@/components/site-diagram/selectivity-list';
import {
  boardFedBy,
  feedOfKey,
  feedWayWords,
  nearLimitBySelectivityOnly,
  type FeedChoice,
  type FeedWay,
  type TreeBoard,
} from '@/components/site-diagram/tree-model';
import { cn } from '@/lib/cn';
import { fedFromWords } from '@/lib/names';
import { ka, ohm, pct } from '@/lib/sites/supply-words';
import type { SiteTreeBoard } from '@/lib/sites/tree-types';

type BoardFeedsProps = {
  /** The site's boards, parents first, with their carried values. */
  boards: readonly SiteTreeBoard[];
  /** Whether the member may link boards (designers and admins on a live site). */
  canLink: boolean;
  /** A feed the designer picked (by the select or by a drop); the view asks before it is saved. */
  onPick: (boardId: string, feed: FeedChoice) => void;
  busy?: boolean;
};

const ORIGIN_TARGET = 'origin';
const targetId = (boardId: string, wayId: string) => `way:${boardId}:${wayId}`;

/** A target's feed choice, from a droppable's id. */
function feedOfTarget(id: string): FeedChoice | null {
  if (id === ORIGIN_TARGET) return { from: 'origin' };
  if (!id.startsWith('way:')) return null;
  const [, boardId, wayId] = id.split(':');
  return feedOfKey(`${boardId}:${wayId}`);
}

/**
 * The site's boards as a stacked list in tree order (each indented below the board that feeds
 * it), with their carried values and worst verdict: the site view's list, readable on a phone.
 * For a designer each board has a "Fed from" choice and a handle to drag it onto a feeding
 * way; each distribution way of a board is a place to drop one (and so is the origin).
 */
export function BoardFeeds({ boards, canLink, onPick, busy }: BoardFeedsProps) {
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 6 } }),
    useSensor(TouchSensor, { activationConstraint: { delay: 200, tolerance: 6 } }),
    useSensor(KeyboardSensor),
  );
  const nameOf = (id: string | number) => boards.find((b) => `board:${b.boardId}` === String(id))?.name ?? 'the board';
  const targetWords = (id: string | number | undefined) => {
    if (id === undefined) return 'no feeding way';
    const feed = feedOfTarget(String(id));
    if (!feed) return 'no feeding way';
    if (feed.from === 'origin') return 'the origin';
    const parent = boards.find((b) => b.boardId === feed.boardId);
    const way = parent?.ways.find((w) => w.id === feed.wayId);
    return fedFromWords({ boardName: parent?.name ?? 'a board', wayLabel: way?.label ?? null });
  };
  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up ${nameOf(active.id)}. Move it over a feeding way and drop it there.`,
    onDragOver: ({ active, over }) => `${nameOf(active.id)} is over ${targetWords(over?.id)}.`,
    onDragEnd: ({ active, over }) =>
      over ? `${nameOf(active.id)} was dropped on ${targetWords(over.id)}.` : `${nameOf(active.id)} was put back.`,
    onDragCancel: ({ active }) => `Moving ${nameOf(active.id)} was cancelled.`,
  };
  const onDragEnd = ({ active, over }: DragEndEvent) => {
    if (!over) return;
    const boardId = String(active.id).replace(/^board:/, '');
    const feed = feedOfTarget(String(over.id));
    if (feed) onPick(boardId, feed);
  };

  return (
    <DndContext
      sensors={sensors}
      onDragEnd={onDragEnd}
      accessibility={{
        announcements,
        screenReaderInstructions: {
          draggable:
            'To feed this board from another way, press Space to pick it up, use the arrow keys to move it over a feeding way, then Space to drop it or Escape to cancel. The Fed from list beside it does the same.',
        },
      }}
    >
      {canLink ? <OriginTarget disabled={busy} /> : null}
      <ol className="flex flex-col gap-3" aria-label="Boards of the site, in supply order">
        {boards.map((b) => (
          <BoardCard key={b.boardId} board={b} boards={boards} canLink={canLink} busy={busy} onPick={onPick} />
        ))}
      </ol>
    </DndContext>
  );
}

function OriginTarget({ disabled }: { disabled?: boolean }) {
  const { setNodeRef, isOver } = useDroppable({ id: ORIGIN_TARGET, disabled });
  return (
    <div
      ref={setNodeRef}
      data-drop-target="origin"
      className={cn(
        'mb-3 flex items-center gap-2 rounded-md border border-dashed border-line-strong px-3 py-2 text-sm text-ink-soft',
        isOver && 'border-copper bg-copper-light/60 text-ink',
      )}
    >
      <PlugZap aria-hidden className="h-4 w-4" />
      Origin (supply intake): drop a board here to feed it straight from the origin
    </div>
  );
}

function BoardCard({
  board,
  boards,
  canLink,
  busy,
  onPick,
}: {
  board: SiteTreeBoard;
  boards: readonly TreeBoard[];
  canLink: boolean;
  busy?: boolean;
  onPick: (boardId: string, feed: FeedChoice) => void;
}) {
  const selectId = useId();
  const { attributes, listeners, setNodeRef, transform, isDragging } = useDraggable({
    id: `board:${board.boardId}`,
    disabled: !canLink || busy,
  });
  const feeding = board.ways.filter((w) => w.distribution);
  const result = board;
  const values = [
    result.zdb ? `Zdb ${ohm(result.zdb.value)}` : null,
    result.pfc ? `PFC ${ka(result.pfc.value)}` : null,
    result.vdUsed ? `volt drop used ${pct(result.vdUsed.value)}` : null,
    result.sizing ? `demand ${result.sizing.summary.maxDemandA.toFixed(1)} A` : null,
  ].filter(Boolean);
  return (
    <li
      ref={setNodeRef}
      data-board-card={board.boardId}
      style={{
        marginLeft: `${Math.min(result.depth ?? 0, 4) * 1.25}rem`,
        transform: transform ? `translate3d(${transform.x}px, ${transform.y}px, 0)` : undefined,
      }}
      className={cn(
        'rounded-card border border-line bg-paper-raised p-3 text-sm',
        isDragging && 'relative z-10 shadow-lg ring-2 ring-copper',
      )}
    >
      <div className="flex items-start gap-2">
        {canLink ? (
          <button
            type="button"
            className="-ml-1 mt-0.5 cursor-grab rounded p-1 text-ink-soft hover:bg-paper-sunk hover:text-ink focus-visible:outline-2 focus-visible:outline-copper active:cursor-grabbing"
            aria-label={`Drag ${board.name} onto a feeding way`}
            {...attributes}
            {...listeners}
          >
            <GripVertical aria-hidden className="h-4 w-4" />
          </button>
        ) : null}
        <div className="min-w-0 flex-1">
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <Link href={`/boards/${board.boardId}`} className="font-semibold text-ink underline hover:text-copper">
              {board.name}
            </Link>
            {result.worstVerdict ? <VerdictBadge verdict={result.worstVerdict} /> : null}
            {nearLimitBySelectivityOnly(result) ? (
              <span className="text-xs text-ink-soft">
                from the selectivity below its sub-main (advisory); every way passes
              </span>
            ) : null}
          </div>
          <p className="mt-1 text-ink-soft">
            {result.problem ? result.problem : values.length ? values.join(' · ') : 'Not sized yet'}
          </p>
          {result.fedFrom ? (
            <p className="mt-1 text-xs text-ink-soft">
              Sub-main: {result.fedFrom.device}, {result.fedFrom.cable}
              {result.phase ? `, on ${result.phase}` : ''}
            </p>
          ) : null}
          {result.selectivity.length ? <SelectivityList groups={result.selectivity} /> : null}
        </div>
      </div>
      {canLink ? (
        <FeedSelect
          id={selectId}
          boards={boards}
          boardId={board.boardId}
          value={board.feed}
          disabled={busy}
          onChange={(key) => onPick(board.boardId, feedOfKey(key))}
        />
      ) : (
        <p className="mt-2 text-xs text-ink-soft">Fed from {fedFromWords(result.fedFrom ?? null)}</p>
      )}
      {canLink && feeding.length ? (
        <ul className="mt-3 flex flex-wrap gap-2" aria-label={`Feeding ways of ${board.name}`}>
          {feeding.map((w) => (
            <WayTarget key={w.id} board={board} way={w} feeds={boardFedBy(boards, w)} disabled={busy} />
          ))}
        </ul>
      ) : null}
    </li>
  );
}

function WayTarget({
  board,
  way,
  feeds,
  disabled,
}: {
  board: TreeBoard;
  way: FeedWay;
  feeds: string | null;
  disabled?: boolean;
}) {
  const { setNodeRef, isOver } = useDroppable({ id: targetId(board.boardId, way.id), disabled });
  return (
    <li
      ref={setNodeRef}
      data-drop-target={`${board.boardId}:${way.id}`}
      className={cn(
        'rounded-md border border-dashed border-line-strong px-2 py-1 text-xs text-ink-soft',
        isOver && 'border-copper bg-copper-light/60 text-ink',
      )}
    >
      <span className="font-medium text-ink">{feedWayWords(way)}</span>
      {feeds ? ` feeds ${feeds}` : ': free, drop a board here'}
    </li>
  );
}
