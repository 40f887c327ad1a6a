import { isProtectiveDevice, parseBoardInput, SizingInputError, type BoardInput } from '@/lib/sizing';
import { layoutWays } from '@/lib/boards/layout';
import { wayName } from '@/lib/names';

import type { SiteBoardInput, SiteTreeInput } from './types';

/** One thing wrong with a site tree: where (dot-separated path) and why, in words. */
export interface SiteTreeIssue {
  path: string;
  message: string;
}

/** The site tree cannot be sized: the message names every problem and the boards concerned. */
export class SiteTreeError extends Error {
  readonly issues: SiteTreeIssue[];
  constructor(issues: SiteTreeIssue[]) {
    super(`The site's supply tree cannot be sized: ${issues.map((i) => i.message).join('; ')}`);
    this.name = 'SiteTreeError';
    this.issues = issues;
  }
}

/** A validated tree: boards by id (each board input parsed by the engine's schema), in tree order. */
export interface ValidTree {
  /** Parents before children; roots (fed from the origin) in input order. */
  order: SiteBoardInput[];
  parsed: Map<string, BoardInput>;
  children: Map<string, string[]>;
  /** Way labels ("3L2") of every board, by way id. */
  labels: Map<string, Map<string, string | null>>;
}

/** The way references of a board's ways, as the rail numbers them. */
export function wayLabels(board: Pick<BoardInput, 'phases' | 'ways'>): Map<string, string | null> {
  return new Map(
    layoutWays(
      board.phases,
      board.ways.map((w, position) => ({ id: w.id, rail: 0, position, device: w.device })),
    ).map((p) => [p.id, p.label]),
  );
}

/**
 * Check a site tree and put it in order. Refused, with every problem named: a board that is
 * not on the site; a board fed from a board that is not on the site (another site's board, or
 * none); a feeding way that does not exist, has no protective device or circuit, is not a
 * distribution circuit, or feeds two boards; a three-phase board on a single-phase way (or the
 * reverse); boards that feed each other in a loop (named in order); and a board whose own input
 * the sizing engine refuses (the engine's field paths, under `boards.<i>.board`).
 * The origin is checked by the engine's supply schema.
 */
export function validateTree(input: SiteTreeInput): ValidTree {
  const issues: SiteTreeIssue[] = [];
  const byId = new Map<string, SiteBoardInput>();
  input.boards.forEach((b, i) => {
    if (byId.has(b.id)) issues.push({ path: `boards.${i}.id`, message: `${b.name} appears twice in the site` });
    byId.set(b.id, b);
  });

  // Each board's own input, through the engine's schema (the origin stands in for its supply).
  const parsed = new Map<string, BoardInput>();
  const labels = new Map<string, Map<string, string | null>>();
  input.boards.forEach((b, i) => {
    try {
      const board = input.parsed?.get(b.id) ?? parseBoardInput({ ...b.board, supply: { ...input.origin } });
      parsed.set(b.id, board);
      labels.set(b.id, wayLabels(board));
    } catch (e) {
      if (!(e instanceof SizingInputError)) throw e;
      for (const issue of e.issues) {
        const origin = issue.path.startsWith('supply');
        issues.push({
          path: origin ? issue.path.replace(/^supply/, 'origin') : `boards.${i}.board.${issue.path}`,
          message: origin
            ? `the origin's ${issue.path.slice(7) || 'supply'}: ${issue.message}`
            : `${b.name}: ${issue.path}: ${issue.message}`,
        });
      }
    }
  });

  const feeders = new Map<string, string>(); // "boardId|wayId" → the board it feeds
  input.boards.forEach((b, i) => {
    if (b.siteId !== input.siteId) {
      issues.push({ path: `boards.${i}.siteId`, message: `${b.name} is not a board of this site` });
    }
    const feed = b.feed;
    if (feed.from !== 'way') return;
    const path = `boards.${i}.feed`;
    const parent = byId.get(feed.boardId);
    if (!parent) {
      issues.push({ path: `${path}.boardId`, message: `${b.name} is fed from a board that is not on this site` });
      return;
    }
    if (parent.siteId !== input.siteId || parent.siteId !== b.siteId) {
      issues.push({
        path: `${path}.boardId`,
        message: `${b.name} cannot be fed from ${parent.name}: ${parent.name} is on another site`,
      });
      return;
    }
    if (parent.id === b.id) {
      issues.push({ path: `${path}.boardId`, message: `${b.name} cannot be fed from one of its own ways` });
      return;
    }
    const way = parent.board.ways.find((w) => w.id === feed.wayId);
    const label = labels.get(parent.id)?.get(feed.wayId) ?? null;
    const wayWords = label ? wayName(label) : 'the chosen way';
    if (!way) {
      issues.push({ path: `${path}.wayId`, message: `${b.name} is fed from a way that ${parent.name} does not have` });
      return;
    }
    const key = `${parent.id}|${way.id}`;
    const other = feeders.get(key);
    if (other !== undefined) {
      issues.push({
        path: `${path}.wayId`,
        message: `${wayWords} of ${parent.name} already feeds ${byId.get(other)?.name ?? 'another board'}; a way feeds one board`,
      });
    }
    feeders.set(key, b.id);
    if (!isProtectiveDevice(way.device.kind) || !way.circuit) {
      issues.push({
        path: `${path}.wayId`,
        message: `${wayWords} of ${parent.name} feeds ${b.name}, so it needs a protective device and a circuit (a sub-main)`,
      });
      return;
    }
    if (way.circuit.use !== 'distribution') {
      issues.push({
        path: `${path}.wayId`,
        message: `${wayWords} of ${parent.name} feeds ${b.name}, so its use must be distribution`,
      });
    }
    if (b.board.phases === 3 && way.circuit.phases !== 3) {
      issues.push({
        path: `${path}.wayId`,
        message: `${b.name} is three-phase: it needs a three-phase sub-main, and ${wayWords} of ${parent.name} is single-phase`,
      });
    }
    if (b.board.phases === 1 && way.circuit.phases === 3) {
      issues.push({
        path: `${path}.wayId`,
        message: `${b.name} is single-phase: feed it from a single-phase way (one phase of ${parent.name}), not from the three-phase ${wayWords}`,
      });
    }
  });

  // Loops: follow each board's feed upwards; a board met twice closes a loop.
  const reported = new Set<string>();
  for (const b of input.boards) {
    const chain: string[] = [];
    let at: SiteBoardInput | undefined = b;
    while (at && at.feed.from === 'way' && !chain.includes(at.id)) {
      chain.push(at.id);
      at = byId.get(at.feed.boardId);
    }
    if (!at || !chain.includes(at.id)) continue;
    const loop = chain.slice(chain.indexOf(at.id));
    if (loop.length === 1) continue; // fed from its own way: said above
    const key = [...loop].sort().join('|');
    if (reported.has(key)) continue;
    reported.add(key);
    // Name the loop in the direction the power would flow: each board feeds the next.
    const names = [...loop].reverse().map((id) => byId.get(id)?.name ?? id);
    issues.push({
      path: `boards.${input.boards.indexOf(byId.get(loop[0])!)}.feed`,
      message: `boards cannot feed each other in a loop: ${[...names, names[0]].join(' feeds ')}`,
    });
  }

  if (issues.length > 0) throw new SiteTreeError(issues);

  const children = new Map<string, string[]>();
  for (const b of input.boards) {
    if (b.feed.from === 'way') children.set(b.feed.boardId, [...(children.get(b.feed.boardId) ?? []), b.id]);
  }
  const order: SiteBoardInput[] = [];
  const visit = (id: string) => {
    order.push(byId.get(id)!);
    for (const c of children.get(id) ?? []) visit(c);
  };
  for (const b of input.boards) if (b.feed.from === 'origin') visit(b.id);
  return { order, parsed, children, labels };
}
