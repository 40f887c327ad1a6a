/**
 * Plain types of a site's supply tree (the method: `sizeSite`, lib/supply/size-site.ts). Pure:
 * no database, no zod model. The board's own part is the sizing
 * engine's board input without its supply (the tree supplies it), so the tree can be wired to
 * the stored board shape later by mapping a stored board to `SiteBoardInput`.
 */
import type { BoardInput, BoardResult, Earthing, Phase, SupplyInput, Verdict } from '@/lib/sizing';
import type { SelectivityOutcome } from '@/lib/names';

/** The supply intake of a site: what the supplier (or a private source) gives at the origin. */
export interface SiteOrigin {
  earthing: Earthing;
  /** Nominal line-to-earth voltage, V (230 on a 230/400 V supply). */
  uoV: number;
  /** External earth fault loop impedance at the origin, Ω. */
  zeOhm: number;
  /** Prospective fault current at the origin, kA (the larger of short-circuit and earth fault). */
  pfcKa: number;
  /** Public supply (3 % / 5 % voltage drop) or private (6 % / 8 %). */
  source: 'public' | 'private';
}

/** A sub-main's design current typed by the designer in place of the board's maximum demand. */
export interface DesignCurrentOverride {
  amps: number;
  /** Why (required): "load study of 2026-11-03", "spare capacity for a kiln". */
  reason: string;
}

/** Where a board's supply comes from: the origin, or one way of another board on the site. */
export type SiteFeed =
  | { from: 'origin' }
  | {
      from: 'way';
      boardId: string;
      wayId: string;
      /** The designer's design current for the sub-main, with a reason; absent: the board's maximum demand. */
      designCurrentOverride?: DesignCurrentOverride | null;
      /**
       * Whether the RCD protecting the sub-main on the board above (an RCBO in the way, or an
       * RCD before it) is time-delayed (type S). The rail device does not record it yet.
       */
      upstreamRcdTimeDelayed?: boolean;
    };

/** A board as the engine's board input, without its supply (the tree gives it). */
export type SiteBoardShape = Omit<BoardInput, 'supply'> & { supply?: unknown };

/** One board of the site. */
export interface SiteBoardInput {
  id: string;
  /** The board's name as the designer gave it ("Workshop DB1"). */
  name: string;
  siteId: string;
  feed: SiteFeed;
  board: SiteBoardShape;
}

/** Input of `sizeSite`: one site, its origin and its boards. */
export interface SiteTreeInput {
  siteId: string;
  origin: SiteOrigin;
  boards: SiteBoardInput[];
  /**
   * Boards the caller has already put through the engine's schema (`parseBoardInput` of the
   * board with the origin as its supply), by board id: not parsed again (a re-size of a whole
   * site parses each board once instead of twice).
   */
  parsed?: ReadonlyMap<string, BoardInput>;
}

/** How a carried value was found: a sentence, the arithmetic step by step, and the sources. */
export interface Working {
  text: string;
  steps: string[];
  sources: string[];
}

/** A number carried down the tree, with its working. */
export interface CarriedValue {
  value: number;
  working: Working;
}

/** The prospective fault current at a board, kA, with both parts. */
export interface CarriedFaultCurrent extends CarriedValue {
  /** Short-circuit current (line–neutral single-phase, three-phase symmetrical), kA. */
  shortCircuitKa: number;
  /** Earth fault current Uo / Zdb with cold conductors, kA. */
  earthFaultKa: number;
}

/** The sub-main's design current: the downstream board's maximum demand, or the designer's. */
export interface SubMainCurrent extends CarriedValue {
  /** The downstream board's maximum demand after diversity, A (the most loaded phase, three-phase). */
  maxDemandA: number;
  override: DesignCurrentOverride | null;
}

/** One pair of devices judged for selectivity: the sub-main's (above) and one on the board below. */
export interface SelectivityPair {
  /** Overcurrent (device against device) or residual current (RCD against RCD). */
  kind: 'overcurrent' | 'residual-current';
  /** The device above, in words ("BS 88-2 fuse 63 A"). */
  upstream: string;
  /** The device below, in words, with its way ("MCB B16, way 3" or "RCD 30 mA, incoming"). */
  downstream: string;
  /** The downstream way's id (null: the board's incoming device). */
  downstreamWayId: string | null;
  outcome: SelectivityOutcome;
  /** For "selective up to": the current up to which it is selective, A. */
  upToA: number | null;
  /** True when the pair is worth the designer's attention (advisory, never a failure). */
  advisory: boolean;
  working: Working;
}

/** What a board is fed from, for display. */
export interface FedFrom {
  boardId: string;
  boardName: string;
  wayId: string;
  /** The printed way reference ("3L2"), null if the way has no number. */
  wayLabel: string | null;
  /** The sub-main's device in words ("MCB C40"). */
  device: string;
  /** The sub-main's cable in words ("16 mm² armoured thermosetting, 35 m, method D"). */
  cable: string;
}

/** Everything carried down to one board, and the board sized with it. */
export interface SiteBoardResult {
  boardId: string;
  name: string;
  /** 0 for a board fed from the origin, 1 below it, ... */
  depth: number;
  /** Null: fed from the origin. */
  fedFrom: FedFrom | null;
  /** The phase a single-phase board takes from a three-phase board's way; null otherwise. */
  phase: Phase | null;
  /** Earth fault loop impedance at the board, Ω (its "Ze" for every way on it). */
  zdb: CarriedValue | null;
  /** Prospective fault current at the board, kA. */
  pfc: CarriedFaultCurrent | null;
  /** Voltage drop used above the board by the sub-mains, % (0 at a board fed from the origin). */
  vdUsed: CarriedValue | null;
  /** The design current of the sub-main feeding this board (null: fed from the origin). */
  subMainCurrent: SubMainCurrent | null;
  /** Selectivity of the sub-main's device against each device on this board. */
  selectivity: SelectivityPair[];
  /** The supply the board was sized with (the carried values as the engine takes them). */
  supply: SupplyInput | null;
  /** The board's input exactly as it was sized (sub-main loads set from the boards they feed). */
  sizedInput: BoardInput | null;
  sizing: BoardResult | null;
  /** Worst verdict of the board: its ways, its board checks, and selectivity (advisory). */
  worstVerdict: Verdict | null;
  /** Why the values could not be carried to this board (the sub-main above could not be sized). */
  problem: string | null;
}

/** Output of `sizeSite`: every board, parents before their children. */
export interface SiteResult {
  siteId: string;
  origin: SiteOrigin;
  boards: SiteBoardResult[];
}
