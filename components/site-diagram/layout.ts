import { cutWithEllipsis } from '@/lib/ellipsis';
import type { SiteBoardResult } from '@/lib/supply';

/** Sizes of the drawing, in viewBox units (the SVG scales to its container's width). */
export const DIAGRAM = {
  margin: 12,
  indent: 36,
  boxWidth: 330,
  boxHeight: 92,
  /** Space above a board for its sub-main's line, symbol and label. */
  feedHeight: 46,
  originHeight: 76,
  /**
   * The characters of a board's name that its box shows (14 px text in the box less its
   * padding: about 0.55 em a character of mixed text; wider text is clipped at the box's edge).
   */
  nameChars: 40,
} as const;

/** A board's name as its box shows it: whole, or cut at a word near its room with an ellipsis. */
export function boxName(name: string, chars: number = DIAGRAM.nameChars): string {
  // The ellipsis takes the last character's room; back to a word's end in the last 30 %
  return name.length <= chars ? name : cutWithEllipsis(name, chars - 1, chars * 0.7);
}

/** What the layout needs of a board: where it hangs in the tree. */
export type LayoutBoard = Pick<SiteBoardResult, 'boardId' | 'depth' | 'fedFrom'>;

/** A board placed on the drawing. */
export interface PlacedBoard<B extends LayoutBoard = SiteBoardResult> {
  board: B;
  x: number;
  y: number;
  /** Where the line feeding it starts (the parent's stem, or the origin's). */
  stemX: number;
  stemTopY: number;
}

/** The drawing's layout: origin at the top, each board below its parent, indented by depth. */
export interface DiagramLayout<B extends LayoutBoard = SiteBoardResult> {
  width: number;
  height: number;
  boards: PlacedBoard<B>[];
}

/**
 * Lay the tree out as an indented column: every board on its own row, in tree order (a board
 * straight after its parent's earlier children), indented one step per level. Each board's
 * stem drops from the left of its parent's box. A column keeps the text the same size for a
 * site of 3 or 30 boards and reads top to bottom on a phone.
 */
export function layoutSite<B extends LayoutBoard>(site: { boards: readonly B[] }): DiagramLayout<B> {
  const { margin, indent, boxWidth, boxHeight, feedHeight, originHeight } = DIAGRAM;
  const placed = new Map<string, PlacedBoard<B>>();
  const out: PlacedBoard<B>[] = [];
  let y = margin + originHeight;
  let maxDepth = 0;
  for (const board of site.boards) {
    const parent = board.fedFrom ? placed.get(board.fedFrom.boardId) : undefined;
    const x = margin + indent * (board.depth + 1);
    const p: PlacedBoard<B> = {
      board,
      x,
      y: y + feedHeight,
      stemX: parent ? parent.x + indent / 2 : margin + indent / 2,
      stemTopY: parent ? parent.y + boxHeight : margin + originHeight - 18,
    };
    placed.set(board.boardId, p);
    out.push(p);
    y += feedHeight + boxHeight;
    maxDepth = Math.max(maxDepth, board.depth);
  }
  return {
    width: margin * 2 + indent * (maxDepth + 1) + boxWidth,
    height: y + margin,
    boards: out,
  };
}
