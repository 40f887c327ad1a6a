import { treeBoardInput, type SizedSite, type TreeBoard } from '@/lib/supply/size-tree';
import { isProtectiveDevice, SIZING_CAUTION } from '@/lib/sizing';
import { groupSelectivity, wayLabels, worstVerdictOf } from '@/lib/supply';

import type { SiteOrigin, SiteTreeBoard, SiteTreeDto, SiteTreeEdge } from './tree-types';

/**
 * The site tree as the site view reads it (lib/dal/site-supply.ts getSiteTree), built from the
 * site's boards and their sizing as one tree (lib/supply/size-tree.ts sizeTree). Pure.
 */

/** The site row the tree DTO is headed with. */
export type TreeHead = { id: string; name: string; origin: SiteOrigin | null; treeVersion: number };

/** The tree DTO from the boards and their sizing as one tree. */
export function treeDtoOf(site: TreeHead, boards: readonly TreeBoard[], sized: SizedSite): SiteTreeDto {
  const byId = new Map(boards.map((b) => [b.id, b]));
  const feeds = new Map<string, string>(); // way id → the board it feeds
  for (const b of boards) if (b.feed.from === 'way' && !sized.detached.has(b.id)) feeds.set(b.feed.wayId, b.id);

  const out: SiteTreeBoard[] = [];
  const edges: SiteTreeEdge[] = [];
  for (const id of treeOrder(boards, sized)) {
    const b = byId.get(id)!;
    const s = sized.boards.get(id);
    const r = s?.result ?? null;
    const sizing = s?.sizing ?? null;
    const ways = treeBoardInput(b).ways;
    const labels = wayLabels({ phases: b.phases, ways });
    const problem =
      r?.problem ?? (s && !sizing ? `${b.name} cannot be sized: ${s.issues.map((i) => i.message).join('; ')}` : null);
    out.push({
      boardId: b.id,
      name: b.name,
      depth: r?.depth ?? 0,
      fedFrom: sized.detached.has(b.id) ? null : (r?.fedFrom ?? null),
      phase: r?.phase ?? null,
      zdb: s?.carried?.zdb ?? r?.zdb ?? null,
      pfc: s?.carried?.pfc ?? r?.pfc ?? null,
      vdUsed: s?.carried?.vdUsed ?? r?.vdUsed ?? null,
      subMainCurrent: s?.carried?.subMainCurrent ?? r?.subMainCurrent ?? null,
      selectivity: groupSelectivity(r?.selectivity ?? []),
      supply: s?.carried?.supply ?? (sizing ? b.supply : null),
      sizing: sizing ? { summary: sizing.summary } : null,
      worstVerdict: sizing ? (r?.worstVerdict ?? worstVerdictOf(sizing, r?.selectivity ?? [])) : null,
      problem,
      location: b.location,
      phases: b.phases,
      status: b.status,
      version: b.version,
      feed: b.feed,
      feedsBoards: b.ways.filter((w) => feeds.has(w.id)).map((w) => ({ wayId: w.id, boardId: feeds.get(w.id)! })),
      ways: ways.map((w) => ({
        id: w.id,
        label: labels.get(w.id) ?? null,
        feedsBoardId: feeds.get(w.id) ?? null,
        distribution: isProtectiveDevice(w.device.kind) && w.circuit?.use === 'distribution',
      })),
    });
    const feed = b.feed;
    if (feed.from === 'way' && !sized.detached.has(b.id) && r?.fedFrom) {
      const parentSizing = sized.boards.get(feed.boardId)?.sizing ?? null;
      edges.push({
        fromBoardId: feed.boardId,
        fromWayId: feed.wayId,
        wayLabel: r.fedFrom.wayLabel,
        toBoardId: b.id,
        device: r.fedFrom.device,
        cable: r.fedFrom.cable,
        verdict: parentSizing?.ways.find((w) => w.id === feed.wayId)?.result?.verdict ?? null,
        designCurrent: r.subMainCurrent,
      });
    }
  }
  return withTreeHead(site, { boards: out, edges });
}

/** The tree DTO of the site's boards and edges (`treeDtoOf`'s, made elsewhere: lib/sites/presize.ts). */
export function withTreeHead(site: TreeHead, parts: Pick<SiteTreeDto, 'boards' | 'edges'>): SiteTreeDto {
  return {
    siteId: site.id,
    siteName: site.name,
    origin: site.origin,
    treeVersion: site.treeVersion,
    boards: parts.boards,
    edges: parts.edges,
    caution: SIZING_CAUTION,
  };
}

/** The tree's boards and edges as JSON text: `{"boards":[…],"edges":[…]}`. */
export const treePartsJson = (tree: Pick<SiteTreeDto, 'boards' | 'edges'>): string =>
  JSON.stringify({ boards: tree.boards, edges: tree.edges });

/**
 * The JSON text of the tree DTO (`withTreeHead`'s, the same text) from its boards and edges as
 * `treePartsJson` wrote them.
 */
export function treeDtoJson(site: TreeHead, parts: string): string {
  const head = JSON.stringify({
    siteId: site.id,
    siteName: site.name,
    origin: site.origin,
    treeVersion: site.treeVersion,
  });
  return `${head.slice(0, -1)},${parts.slice(1, -1)},"caution":${JSON.stringify(SIZING_CAUTION)}}`;
}

/** The boards' ids in tree order: those sizeSite placed (parents first), then the others as read. */
export function treeOrder(boards: readonly TreeBoard[], sized: SizedSite): string[] {
  const placed = sized.site.boards.map((r) => r.boardId);
  return [...placed, ...boards.map((b) => b.id).filter((id) => !placed.includes(id))];
}
