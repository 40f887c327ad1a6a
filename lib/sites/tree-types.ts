/**
 * A site's supply tree as the API hands it over: plain data and zod schemas, safe for the
 * browser (no database, no server-only module). The method and the values are lib/supply's
 * (`sizeSite`, lib/supply/size-site.ts), stored with each board's sizing.
 *
 * Routes (request → answer):
 * - `GET  /api/sites/[siteId]/tree` → `{ tree: SiteTreeDto }` (anyone who may read boards).
 * - `PUT  /api/sites/[siteId]/origin` `SiteOriginInput` → `{ tree: SiteTreeDto, ripple: SiteRipple }`
 *   (designers and admins); every board fed from the origin, and all below, is re-sized.
 * - `PUT  /api/boards/[boardId]/feed` `BoardFeedInput` → `{ board: BoardDto, ripple: SiteRipple }`;
 *   409 `FeedChangesConflict` when other boards would change and `confirmFeedChanges` is not true;
 *   422 `FeedRefusal` for a cycle or a way that cannot feed a board; 404 for a board or way of
 *   another organisation or site.
 * - `PUT  /api/boards/[boardId]` (the whole-board save) also takes `settings.feed` and
 *   `confirmFeedChanges`, answers `{ board, ripple }` and 409 `FeedChangesConflict` likewise.
 * - `DELETE /api/boards/[boardId]` and `POST /api/boards/[boardId]/archive` take
 *   `?confirmFeedChanges=1` (`removalQuerySchema`): a board that feeds other boards is not
 *   removed unasked (409 `FeedChangesConflict`, reason `board-removed`); confirmed, those boards
 *   go back to the origin and the answer lists them as `feedChanges`.
 * - `GET  /api/sites/[siteId]/pack` → `application/pdf` (admins, designers, inspectors): the
 *   diagram and carried values, then each board's schedule (issued file where issued, else draft).
 * - `POST /api/sites/[siteId]/pack/email` `SitePackEmailInput` → 202 `{ mail: { id, to } }`.
 */
import { z } from 'zod';

import { boardFeedSchema, type BoardDto, type BoardFeed } from '@/lib/boards/schemas';
import type { BoardStatus } from '@/lib/domain';
import { supplySchema, type BoardResult, type Phase, type SupplyInput, type Verdict } from '@/lib/sizing';
import type {
  CarriedFaultCurrent,
  CarriedValue,
  FedFrom,
  SelectivityPair,
  SiteBoardResult,
  SiteOrigin,
  SubMainCurrent,
} from '@/lib/supply/types';
import type { SelectivityGroup } from '@/lib/supply/group-selectivity';

export type { SelectivityGroup };
export type { BoardFeed, CarriedFaultCurrent, CarriedValue, FedFrom, SelectivityPair, SiteOrigin, SubMainCurrent };

/** The origin of a site (its supply intake) as a request gives it: a board's supply without volt drop used. */
export const siteOriginSchema = supplySchema.omit({ vdUsedPct: true }).strict();
export type SiteOriginInput = z.infer<typeof siteOriginSchema>;

/** `PUT /api/boards/[boardId]/feed`. */
export const boardFeedInputSchema = z
  .object({
    /** The board's version as loaded (optional: a stale one is 409). */
    version: z.number().int().min(1).optional(),
    feed: boardFeedSchema,
    confirmFeedChanges: z.boolean().optional(),
  })
  .strict();
export type BoardFeedInput = z.infer<typeof boardFeedInputSchema>;

/**
 * The query of `DELETE /api/boards/[boardId]` and `POST /api/boards/[boardId]/archive`:
 * `confirmFeedChanges=1` lets the boards fed from the board go back to the origin.
 */
export const removalQuerySchema = z.object({
  confirmFeedChanges: z
    .enum(['1', 'true'], { error: 'Give confirmFeedChanges=1 to confirm, or leave it out.' })
    .optional()
    .transform((v) => v !== undefined),
});
export type RemovalQuery = z.output<typeof removalQuerySchema>;

/** `POST /api/sites/[siteId]/pack/email`. */
export const sitePackEmailSchema = z
  .object({
    to: z.email('Give a valid e-mail address.').max(254),
    message: z.string().trim().max(2000, 'Keep the message under 2000 characters.').optional(),
  })
  .strict();
export type SitePackEmailInput = z.infer<typeof sitePackEmailSchema>;

/**
 * What a board is sized with when it is not its typed supply (stored with its sizing, and in the
 * board DTO as `derivedSupply`): fed from the origin, or carried down a sub-main with the working.
 */
export interface DerivedSupply {
  from: 'origin' | 'way';
  /** The supply the engine sized the board with (Ze := Zdb, PFC := carried, vdUsedPct). */
  supply: SupplyInput;
  /** The way that feeds the board ("fed from Workshop DB1, way 3L2"); null from the origin. */
  fedFrom: FedFrom | null;
  /** The phase a single-phase board takes from a three-phase board's way. */
  phase: Phase | null;
  zdb: CarriedValue | null;
  pfc: CarriedFaultCurrent | null;
  vdUsed: CarriedValue | null;
  subMainCurrent: SubMainCurrent | null;
  /** Why the values could not be carried (then the board is sized with its typed supply). */
  problem: string | null;
  /** The site's tree version the values were carried at. */
  treeVersion: number;
}

/** One board of the tree: what the site view and the site pack show of it. */
export type SiteTreeBoard = Omit<SiteBoardResult, 'sizing' | 'sizedInput' | 'selectivity'> & {
  /** Selectivity below the sub-main feeding it, one entry per judgement with the ways it covers. */
  selectivity: SelectivityGroup[];
  /** The sizing's summary only (counts, maximum demand, board checks); the board's own route has the rest. */
  sizing: { summary: BoardResult['summary'] } | null;
  location: string;
  phases: 1 | 3;
  status: BoardStatus;
  version: number;
  feed: BoardFeed;
  /** The ways of the board that are sub-mains feeding other boards. */
  feedsBoards: { wayId: string; boardId: string }[];
  /** Every way of the board with its printed reference, for choosing a feeding way. */
  ways: { id: string; label: string | null; feedsBoardId: string | null; distribution: boolean }[];
};

/** A sub-main: the way of one board that feeds another, with its device and cable. */
export interface SiteTreeEdge {
  fromBoardId: string;
  fromWayId: string;
  wayLabel: string | null;
  toBoardId: string;
  /** The sub-main's device in words ("MCB C40"). */
  device: string;
  /** The sub-main's cable in words. */
  cable: string;
  /** The sub-main's verdict on the upstream board (null: not sized). */
  verdict: Verdict | null;
  designCurrent: SubMainCurrent | null;
}

/** `GET /api/sites/[siteId]/tree`: the site's supply tree, boards parents first. */
export interface SiteTreeDto {
  siteId: string;
  siteName: string;
  /** The site's origin; null when not given yet (boards fed from it use their typed supply). */
  origin: SiteOrigin | null;
  treeVersion: number;
  boards: SiteTreeBoard[];
  edges: SiteTreeEdge[];
  /** The design-aid caution (lib/sizing SIZING_CAUTION). */
  caution: string;
}

/** A way whose verdict changed in a ripple. */
export interface RippleWayChange {
  wayId: string;
  wayLabel: string | null;
  before: Verdict | null;
  after: Verdict | null;
}

/** One board re-sized by a ripple. */
export interface RippleBoard {
  boardId: string;
  name: string;
  /** The values carried to it changed (its supply is derived). */
  supplyChanged: boolean;
  worstBefore: Verdict | null;
  worstAfter: Verdict | null;
  changedWays: RippleWayChange[];
}

/** What a tree-affecting write did to the whole site: the boards whose supply or verdicts changed. */
export interface SiteRipple {
  siteId: string;
  treeVersion: number;
  boards: RippleBoard[];
}

/** A board whose feed a save changes (a feeding way removed, moved or re-pointed). */
export interface FeedChange {
  boardId: string;
  name: string;
  /** What it is fed from now. */
  from: FedFrom | null;
  /** What it will be fed from: the origin. */
  to: 'origin';
  /** `board-removed`: the board that feeds it is being deleted or archived. */
  reason: 'way-removed' | 'way-moved' | 'feed-changed' | 'board-removed';
}

/** The 409 answer of a save that changes other boards' feed without `confirmFeedChanges: true`. */
export interface FeedChangesConflict {
  error: string;
  feedChanges: FeedChange[];
}

/** The 422 answer of a feed that cannot be: a cycle, or a way that cannot feed a board. */
export interface FeedRefusal {
  error: string;
  issues: { path: string; message: string }[];
  /** The boards in the cycle, in order, when it is a cycle. */
  cycle?: { boardId: string; name: string }[];
}

/** The board save's answer: the board, and what the save did to the rest of the site. */
export interface BoardSaveAnswer {
  board: BoardDto;
  ripple: SiteRipple | null;
}
