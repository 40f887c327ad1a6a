import { isDeepStrictEqual } from 'node:util';

import { engineInputOf, type BoardFeed, type BoardSettings, type WayInput } from '@/lib/boards/schemas';
import type { BoardStatus } from '@/lib/domain';
import type { FieldIssue } from '@/lib/errors';
import { engineIssues, sizeDesign } from '@/lib/boards/size-design';
import type { DerivedSupply, SiteOrigin } from '@/lib/sites/tree-types';
import {
  parseBoardInput,
  reviseBoardInput,
  type BoardInput,
  type BoardResult,
  type SupplyInput,
  type Verdict,
} from '@/lib/sizing';
import { deepFreeze } from '@/lib/sizing/validate';

import { sizeSite, sizingOutcome, type SizingOutcome } from './size-site';
import type { SiteBoardInput, SiteBoardResult, SiteResult } from './types';
import { SiteTreeError, wayLabels } from './validate-tree';

/**
 * A site's boards as the server holds them, sized as one tree: pure computation on what
 * lib/dal/site-tree.ts reads (no database). `sizeTree` sizes every board of a site with the
 * values carried to it; one board alone is sized by `sizeDesign` (lib/boards/size-design.ts).
 */

/** One board of a site as the tree needs it: settings, ways, feed and what was stored for it. */
export type TreeBoard = BoardSettings & {
  id: string;
  status: BoardStatus;
  version: number;
  archived: boolean;
  ways: WayInput[];
  feed: BoardFeed;
  /**
   * What was stored for it: the whole sizing (`readTreeBoards` by default), or (`stored:
   * 'outcome'`) its `outcome` only, with the whole sizing only for a row stored without one.
   */
  stored: {
    version: number;
    sizing?: BoardResult | null;
    carried: DerivedSupply | null;
    outcome?: SizingOutcome | null;
    /** The SHA-256 (hex) of the sizing's JSON text (null: stored before migration 0013). */
    sha?: string | null;
    /** Its whole sizing is still to be stored (migration 0013). */
    pending?: boolean;
    /** Whether the review page's cut of it is stored too (migration 0015). */
    review?: boolean;
  } | null;
};

/** What sizing the whole site gives each board: the stored form and the tree's values. */
export type SizedSite = {
  /** Per board: its sizing (null: the engine refused it), the issues, and what was carried to it. */
  boards: Map<
    string,
    { sizing: BoardResult | null; issues: FieldIssue[]; carried: DerivedSupply | null; result: SiteBoardResult | null }
  >;
  /** The tree as sizeSite answered it (boards it could size, parents first). */
  site: SiteResult;
  /** Feeds that could not be followed (a broken or refused link): board id → why. */
  detached: Map<string, string>;
};

/** The origin's supply fields alone (a board's typed supply less its volt drop used). */
export const originSupply = (o: SiteOrigin): SupplyInput => ({
  earthing: o.earthing,
  uoV: o.uoV,
  zeOhm: o.zeOhm,
  pfcKa: o.pfcKa,
  source: o.source,
});

/** A board's engine input, and that input as the engine's schema parses it with its typed supply (null: refused). */
type Prepared = { input: BoardInput; parsed: BoardInput | null };

/**
 * The engine input of each frozen board (lib/dal's `readTreeBoards` hands out the same frozen
 * object while a board is unchanged): a site re-sized again parses only the supply carried to
 * each board (`reviseBoardInput`), not its ways again.
 */
const preparedBoards = new WeakMap<TreeBoard, Prepared>();

function prepare(b: TreeBoard): Prepared {
  const held = preparedBoards.get(b);
  if (held) return held;
  const frozen = Object.isFrozen(b);
  const input = engineInputOf(b, b.ways);
  if (frozen) deepFreeze(input);
  let parsed: BoardInput | null = null;
  try {
    parsed = parseBoardInput(input);
  } catch {
    // Parsed whole with the supply it is sized with (`withSupply`), which names what is wrong
  }
  const out = { input, parsed };
  if (frozen) preparedBoards.set(b, out);
  return out;
}

/** The engine input of a board of a site (`engineInputOf` of its settings and ways). */
export const treeBoardInput = (b: TreeBoard): BoardInput => prepare(b).input;

/** What `parseBoardInput({ ...input, supply })` answers (or throws), for less when the board parsed. */
const withSupply = (p: Prepared, supply: unknown): BoardInput =>
  p.parsed ? reviseBoardInput(p.parsed, supply, p.parsed.ways) : parseBoardInput({ ...p.input, supply });

/** The tree issues (lib/supply validateTree) that name a board's feed: board index → message. */
function feedIssues(err: SiteTreeError): Map<number, string> {
  const out = new Map<number, string>();
  for (const i of err.issues) {
    const m = /^boards\.(\d+)\.(feed|board)/.exec(i.path);
    if (m) out.set(Number(m[1]), [out.get(Number(m[1])), i.message].filter(Boolean).join('; '));
  }
  return out;
}

/**
 * Sizes a site's boards as one tree. The origin is the site's; a site without one yet sizes
 * each board fed from the origin with its own typed supply (as before the tree existed). A
 * board the engine refuses is stored with its issues and cannot feed anything; a board whose
 * feed cannot be followed (a refused parent, a way no longer fit to feed it) is sized with its
 * typed supply and says why (`problem`). Pure: no database.
 */
export function sizeTree(siteId: string, origin: SiteOrigin | null, boards: readonly TreeBoard[]): SizedSite {
  const out: SizedSite['boards'] = new Map();
  const detached = new Map<string, string>();
  const byId = new Map(boards.map((b) => [b.id, b]));
  // Boards the engine refuses on their own: stored with their issues, never in the tree. With
  // the site's origin, each board parsed here is handed to sizeSite (parsed once, not twice).
  const inTree = new Set<string>();
  const prepared = new Map(boards.map((b) => [b.id, prepare(b)]));
  const inputs = new Map(boards.map((b) => [b.id, prepared.get(b.id)!.input]));
  const parsed = new Map<string, BoardInput>();
  for (const b of boards) {
    try {
      parsed.set(b.id, withSupply(prepared.get(b.id)!, origin ? originSupply(origin) : b.supply));
      inTree.add(b.id);
    } catch (err) {
      out.set(b.id, { sizing: null, issues: engineIssues(err), carried: null, result: null });
    }
  }
  // Feeds from a board outside the tree are cut
  const feedOf = new Map<string, BoardFeed>();
  for (const b of boards) {
    if (!inTree.has(b.id)) continue;
    if (b.feed.from === 'way' && !inTree.has(b.feed.boardId)) {
      const parent = byId.get(b.feed.boardId);
      detached.set(
        b.id,
        parent
          ? `${parent.name} cannot be sized (see its checks), so no values can be carried to ${b.name}.`
          : `The board that fed ${b.name} is no longer on the site.`,
      );
      feedOf.set(b.id, { from: 'origin' });
    } else feedOf.set(b.id, b.feed);
  }
  // Each group of boards under one origin: the site's, or (none given) each root's typed supply
  const roots = boards.filter((b) => inTree.has(b.id) && feedOf.get(b.id)?.from === 'origin');
  const groups: { origin: SiteOrigin; ids: string[] }[] = [];
  if (origin) groups.push({ origin, ids: boards.filter((b) => inTree.has(b.id)).map((b) => b.id) });
  else {
    const below = new Map<string, string[]>();
    for (const b of boards) {
      const f = feedOf.get(b.id);
      if (f?.from === 'way') below.set(f.boardId, [...(below.get(f.boardId) ?? []), b.id]);
    }
    const seen = new Set<string>();
    for (const r of roots) {
      const ids: string[] = [];
      const visit = (id: string) => {
        if (seen.has(id)) return;
        seen.add(id);
        ids.push(id);
        for (const c of below.get(id) ?? []) visit(c);
      };
      visit(r.id);
      groups.push({ origin: originSupply(r.supply), ids });
    }
    // Boards in a loop (never reached from a root): cut
    for (const b of boards) {
      if (inTree.has(b.id) && !seen.has(b.id)) {
        detached.set(b.id, `${b.name} is fed in a loop of boards.`);
        feedOf.set(b.id, { from: 'origin' });
        groups.push({ origin: originSupply(b.supply), ids: [b.id] });
      }
    }
  }

  const all: SiteBoardResult[] = [];
  for (const g of groups) {
    const members = g.ids.map((id) => byId.get(id)!);
    // A feed the tree refuses (a way no longer fit to feed, a loop) is cut, and the rest sized
    for (let attempt = 0; attempt <= members.length; attempt++) {
      const input: SiteBoardInput[] = members.map((b) => ({
        id: b.id,
        name: b.name,
        siteId,
        feed: feedOf.get(b.id)!,
        board: inputs.get(b.id)!,
      }));
      try {
        const sized = sizeSite({ siteId, origin: g.origin, boards: input, parsed: origin ? parsed : undefined });
        all.push(...sized.boards);
        break;
      } catch (err) {
        if (!(err instanceof SiteTreeError)) throw err;
        const bad = feedIssues(err);
        if (!bad.size) throw err;
        for (const [i, message] of bad) {
          const b = members[i];
          detached.set(b.id, message);
          feedOf.set(b.id, { from: 'origin' });
        }
      }
    }
  }

  for (const r of all) {
    const b = byId.get(r.boardId)!;
    const problem = r.problem ?? detached.get(b.id) ?? null;
    let sizing = r.sizing;
    let issues: FieldIssue[] = [];
    if (!sizing || detached.has(b.id)) {
      // Nothing could be carried to it: sized with the origin's or its typed supply, saying why
      ({ sizing, issues } = sizeDesign({ ...b, supply: origin ? originSupply(origin) : b.supply }));
    }
    const fromWay = b.feed.from === 'way';
    const carried: DerivedSupply | null =
      !origin && !fromWay
        ? null
        : {
            from: fromWay ? 'way' : 'origin',
            supply: r.supply && !detached.has(b.id) ? r.supply : origin ? originSupply(origin) : b.supply,
            fedFrom: detached.has(b.id) ? null : r.fedFrom,
            phase: r.phase,
            zdb: detached.has(b.id) ? null : r.zdb,
            pfc: detached.has(b.id) ? null : r.pfc,
            vdUsed: detached.has(b.id) ? null : r.vdUsed,
            subMainCurrent: detached.has(b.id) ? null : r.subMainCurrent,
            problem,
            treeVersion: 0,
          };
    out.set(b.id, { sizing, issues, carried, result: { ...r, problem, sizing } });
  }
  return { boards: out, site: { siteId, origin: origin ?? groups[0]?.origin ?? null!, boards: all }, detached };
}

/** A board's way labels ("3L2"), by way id. */
export const wayLabelsOf = (b: TreeBoard) => wayLabels({ phases: b.phases, ways: engineInputOf(b, b.ways).ways });

/** What a stored sizing gave: its way verdicts and worst verdict (its stored outcome, else from the sizing). */
export function storedOutcome(stored: NonNullable<TreeBoard['stored']>): SizingOutcome | null {
  return stored.outcome ?? (stored.sizing ? sizingOutcome(stored.sizing) : null);
}

// Compared as values: the stored copy is jsonb, which orders its keys its own way
export const sameSupply = (a: SupplyInput | null | undefined, b: SupplyInput | null | undefined) =>
  isDeepStrictEqual(a ?? null, b ?? null);
export const sameOrigin = (a: SiteOrigin | null, b: SiteOrigin | null) => isDeepStrictEqual(a, b);

/** What a re-size stores and compares of one board's sizing, without the sizing itself. */
export type SizedBrief = {
  /** The engine refused the board (its issues say why). */
  refused: boolean;
  issues: FieldIssue[];
  carried: DerivedSupply | null;
  outcome: SizingOutcome | null;
  /** The board's worst verdict, selectivity counted (the ripple's). */
  worst: Verdict | null;
};

/** Each board's brief of a sized site (`SizedBrief`). */
export function briefsOf(sized: SizedSite): Map<string, SizedBrief> {
  const out = new Map<string, SizedBrief>();
  for (const [id, s] of sized.boards) {
    const outcome = s.sizing && sizingOutcome(s.sizing);
    out.set(id, {
      refused: s.sizing === null,
      issues: s.issues,
      carried: s.carried,
      outcome,
      worst: s.result?.worstVerdict ?? outcome?.worst ?? null,
    });
  }
  return out;
}
