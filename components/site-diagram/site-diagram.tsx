import { useId, type KeyboardEvent, type MouseEvent } from 'react';

import { VERDICT_LOOKS } from '@/components/sizing/verdict-badge';
import { EARTHING_NAMES, fedFromWords, SUPPLY_SOURCE_NAMES, VERDICT_WORDS } from '@/lib/names';
import { amps, ka, ohm, pct } from '@/lib/sites/supply-words';
import type { BoardSummary } from '@/lib/sizing';
import type { SiteBoardResult, SiteOrigin } from '@/lib/supply';

import { boxName, DIAGRAM, layoutSite, type PlacedBoard } from './layout';

/** A board as the diagram draws it: its carried values, worst verdict and maximum demand. */
export type DiagramBoard = Omit<SiteBoardResult, 'sizing' | 'sizedInput' | 'selectivity'> & {
  sizing: { summary: Pick<BoardSummary, 'maxDemandA'> } | null;
};

/** A site as the diagram draws it (`sizeSite`'s result, or the tree the site route answers). */
export interface DiagramSite {
  /** Null: the site's origin is not given yet. */
  origin: SiteOrigin | null;
  boards: readonly DiagramBoard[];
}

type SiteDiagramProps = {
  site: DiagramSite;
  /** The site's name, for the drawing's title. */
  siteName: string;
  /** Where a board opens (a link); without it, `onOpenBoard` makes each board a button. */
  hrefOf?: (boardId: string) => string;
  /** Called when a board is opened (click, Enter or Space). */
  onOpenBoard?: (boardId: string) => void;
  className?: string;
};

/** The carried values of a board in one sentence, for its accessible name and the list below. */
export function boardSummaryWords(b: DiagramBoard): string {
  const parts = [`${b.name}: fed from ${fedFromWords(b.fedFrom)}`];
  if (b.fedFrom) parts.push(`sub-main ${b.fedFrom.device}, ${b.fedFrom.cable}`);
  if (b.phase) parts.push(`on ${b.phase}`);
  if (b.problem) parts.push(b.problem);
  if (b.zdb) parts.push(`earth fault loop impedance at the board ${ohm(b.zdb.value)}`);
  if (b.pfc) parts.push(`prospective fault current ${ka(b.pfc.value)}`);
  if (b.vdUsed) parts.push(`volt drop used above it ${pct(b.vdUsed.value)}`);
  if (b.sizing) parts.push(`maximum demand ${amps(b.sizing.summary.maxDemandA)}`);
  parts.push(b.worstVerdict ? `worst verdict: ${VERDICT_WORDS[b.worstVerdict]}` : 'not sized');
  return parts.join('; ');
}

/**
 * IEC 60617 symbols for the sub-main's device, drawn on a vertical conductor: a fuse
 * (S00362: a rectangle with the conductor through it) or a circuit-breaker (S00287: a make
 * contact with a cross at its fixed end). Anything else draws a plain conductor.
 */
function DeviceSymbol({ kind, x, y }: { kind: string; x: number; y: number }) {
  if (kind.startsWith('fuse')) {
    return (
      <g aria-hidden="true" className="stroke-ink" fill="none" strokeWidth={1.5}>
        <rect x={x - 5} y={y} width={10} height={22} className="fill-paper-raised" />
        <line x1={x} y1={y - 2} x2={x} y2={y + 24} />
      </g>
    );
  }
  if (kind === 'mcb' || kind === 'rcbo') {
    return (
      <g aria-hidden="true" className="stroke-ink" fill="none" strokeWidth={1.5}>
        {/* The contact replaces the conductor: paper over the line behind it. */}
        <rect x={x - 12} y={y + 4} width={16} height={18} className="fill-paper stroke-none" />
        <line x1={x} y1={y - 2} x2={x} y2={y + 4} />
        <line x1={x - 4} y1={y} x2={x + 4} y2={y + 8} />
        <line x1={x + 4} y1={y} x2={x - 4} y2={y + 8} />
        <line x1={x} y1={y + 22} x2={x - 10} y2={y + 5} />
        <line x1={x} y1={y + 22} x2={x} y2={y + 26} />
      </g>
    );
  }
  return null;
}

function VerdictMark({ b, x, y }: { b: DiagramBoard; x: number; y: number }) {
  if (!b.worstVerdict) {
    return (
      <text x={x} y={y} className="fill-ink-soft text-[12px]">
        Not sized
      </text>
    );
  }
  const look = VERDICT_LOOKS[b.worstVerdict];
  const Icon = look.icon;
  return (
    <g className={look.text}>
      <Icon x={x} y={y - 12} width={14} height={14} aria-hidden="true" />
      <text x={x + 18} y={y} className="fill-current text-[12px] font-semibold">
        {VERDICT_WORDS[b.worstVerdict]}
      </text>
    </g>
  );
}

function BoardNode({
  placed,
  hrefOf,
  onOpenBoard,
}: {
  placed: PlacedBoard<DiagramBoard>;
  hrefOf?: (boardId: string) => string;
  onOpenBoard?: (boardId: string) => void;
}) {
  const { board: b, x, y, stemX, stemTopY } = placed;
  const { boxWidth: w, boxHeight: h, feedHeight } = DIAGRAM;
  const midY = y + 22;
  const href = hrefOf?.(b.boardId);
  const open = (e: MouseEvent | KeyboardEvent) => {
    if (!onOpenBoard) return;
    if (!href) e.preventDefault();
    onOpenBoard(b.boardId);
  };
  const onKeyDown = (e: KeyboardEvent) => {
    if (!href && (e.key === 'Enter' || e.key === ' ')) open(e);
  };
  const values = [b.zdb ? `Zdb ${ohm(b.zdb.value)}` : null, b.pfc ? `PFC ${ka(b.pfc.value)}` : null].filter(Boolean);
  const second = [
    b.vdUsed ? `Volt drop used ${pct(b.vdUsed.value)}` : null,
    b.sizing ? `Demand ${amps(b.sizing.summary.maxDemandA)}` : null,
  ].filter(Boolean);
  return (
    <g role="listitem">
      {/* The sub-main: a line down the parent's stem, its device, and across to this board. */}
      <path
        d={`M ${stemX} ${stemTopY} V ${midY} H ${x}`}
        fill="none"
        className="stroke-ink-soft"
        strokeWidth={1.5}
        aria-hidden="true"
      />
      {b.fedFrom ? (
        <>
          <DeviceSymbol kind={deviceKindOf(b)} x={stemX} y={y - feedHeight + 8} />
          <text x={x} y={y - feedHeight + 18} className="fill-ink text-[12px]">
            {b.fedFrom.device}
            {b.fedFrom.wayLabel ? ` (way ${b.fedFrom.wayLabel})` : ''}
            {b.phase ? `, ${b.phase}` : ''}
          </text>
          <text x={x} y={y - feedHeight + 34} className="fill-ink-soft text-[11px]">
            {b.fedFrom.cable}
          </text>
        </>
      ) : null}
      <a
        href={href}
        onClick={open}
        onKeyDown={onKeyDown}
        role={href ? undefined : 'button'}
        tabIndex={href ? undefined : 0}
        aria-label={boardSummaryWords(b)}
        className="cursor-pointer outline-none focus-visible:[&>rect]:stroke-copper focus-visible:[&>rect]:[stroke-width:3]"
      >
        <rect
          x={x}
          y={y}
          width={w}
          height={h}
          rx={8}
          className="fill-paper-raised stroke-line-strong"
          strokeWidth={1.5}
        />
        {/* The name, cut to its box (its whole is the tooltip and in the link's name) */}
        <svg x={x + 12} y={y} width={w - 24} height={30} overflow="hidden">
          <text x={0} y={22} className="fill-ink text-[14px] font-semibold underline">
            {boxName(b.name)}
            {boxName(b.name) === b.name ? null : <title>{b.name}</title>}
          </text>
        </svg>
      </a>
      {/*
        The values are in the link's name already, which starts with its visible text (the
        board's name); drawn outside the link so that the visible text inside it is the name
        alone, and let clicks through to the link's box beneath.
      */}
      <g aria-hidden="true" className="pointer-events-none">
        <text x={x + 12} y={y + 42} className="fill-ink text-[12px]">
          {b.problem ? 'No carried values: see the sub-main above' : values.join(' · ')}
        </text>
        <text x={x + 12} y={y + 60} className="fill-ink-soft text-[12px]">
          {second.join(' · ')}
        </text>
        <VerdictMark b={b} x={x + 12} y={y + 80} />
      </g>
    </g>
  );
}

function deviceKindOf(b: DiagramBoard): string {
  const d = b.fedFrom?.device ?? '';
  if (d.startsWith('MCB')) return 'mcb';
  if (d.startsWith('RCBO')) return 'rcbo';
  if (d.includes('fuse')) return 'fuse';
  return 'other';
}

/**
 * A single-line diagram of a site drawn from its supply tree: the origin at the top, each
 * board below the board that feeds it with its carried values (Zdb, prospective fault current,
 * volt drop used, maximum demand) and its worst verdict in words and an icon, each sub-main
 * with its device (IEC 60617 symbol) and cable in words. Each board is a link (or a button)
 * whose accessible name carries all its values; the SVG scales to its container's width.
 */
export function SiteDiagram({ site, siteName, hrefOf, onOpenBoard, className }: SiteDiagramProps) {
  const id = useId();
  const layout = layoutSite(site);
  const o = site.origin;
  const { margin, originHeight } = DIAGRAM;
  const originWords = o
    ? `${EARTHING_NAMES[o.earthing] ?? o.earthing}, Uo ${o.uoV} V, Ze ${ohm(o.zeOhm)}, PFC ${ka(o.pfcKa)}, ${SUPPLY_SOURCE_NAMES[o.source]}`
    : 'not given yet: each board fed from it is sized with its own typed supply';
  return (
    <svg
      viewBox={`0 0 ${layout.width} ${layout.height}`}
      width="100%"
      preserveAspectRatio="xMinYMin meet"
      aria-labelledby={`${id}-title ${id}-desc`}
      className={className}
      style={{ maxWidth: layout.width }}
      fontFamily="var(--font-sans), system-ui, sans-serif"
    >
      <title id={`${id}-title`}>{`Single-line diagram of ${siteName}`}</title>
      <desc id={`${id}-desc`}>
        {`The origin (${originWords}) feeds ${site.boards.length === 1 ? 'one board' : `${site.boards.length} boards`}; each board is listed below the board that feeds it, with the values carried down to it and its worst verdict.`}
      </desc>
      <g role="list">
        <g role="listitem" aria-label={`Origin (supply intake): ${originWords}`}>
          <rect
            x={margin}
            y={margin}
            width={DIAGRAM.boxWidth}
            height={originHeight - 18}
            rx={8}
            className="fill-paper-sunk stroke-line-strong"
            strokeWidth={1.5}
          />
          <text x={margin + 12} y={margin + 18} className="fill-ink text-[13px] font-semibold" aria-hidden="true">
            Origin (supply intake)
          </text>
          <text x={margin + 12} y={margin + 35} className="fill-ink-soft text-[11px]" aria-hidden="true">
            {o
              ? `${EARTHING_NAMES[o.earthing] ?? o.earthing}, Uo ${o.uoV} V, ${SUPPLY_SOURCE_NAMES[o.source].toLowerCase()}`
              : 'Values not given yet'}
          </text>
          <text x={margin + 12} y={margin + 50} className="fill-ink-soft text-[11px]" aria-hidden="true">
            {o ? `Ze ${ohm(o.zeOhm)}, prospective fault current ${ka(o.pfcKa)}` : 'Boards use their typed supply'}
          </text>
        </g>
        {layout.boards.map((p) => (
          <BoardNode key={p.board.boardId} placed={p} hrefOf={hrefOf} onOpenBoard={onOpenBoard} />
        ))}
      </g>
    </svg>
  );
}
