import { describe, expect, it } from 'vitest';

import { sizeSite, SiteTreeError, type SiteTreeInput } from '@/lib/supply';

import { fixedWay, threeLevel, twoLevel } from './fixtures';

function issuesOf(input: SiteTreeInput): string[] {
  try {
    sizeSite(input);
  } catch (e) {
    if (e instanceof SiteTreeError) return e.issues.map((i) => `${i.path}: ${i.message}`);
    throw e;
  }
  throw new Error('the tree was accepted');
}

const distributionWay = (id: string) => ({
  id,
  device: { kind: 'mcb', poles: 1, modules: 1, curve: 'C', ratingA: 32 },
  circuit: {
    phases: 1,
    use: 'distribution',
    load: { kind: 'known', watts: 0, powerFactor: 1 },
    lengthM: 10,
    cable: 'te-70',
    method: 'C',
    ambientC: 30,
    csaMm2: 6,
  },
});

describe('validateTree (through sizeSite)', () => {
  it('refuses boards that feed each other in a loop, naming them in order', () => {
    const t = twoLevel();
    const a = {
      id: 'a',
      name: 'Store board',
      siteId: 'hollin-lane',
      feed: { from: 'way', boardId: 'b', wayId: 'b-sub' },
      board: {
        phases: 1,
        enclosureModules: 6,
        incoming: { kind: 'main-switch', ratingA: 63 },
        ways: [distributionWay('a-sub')],
      },
    };
    const b = {
      id: 'b',
      name: 'Yard board',
      siteId: 'hollin-lane',
      feed: { from: 'way', boardId: 'a', wayId: 'a-sub' },
      board: {
        phases: 1,
        enclosureModules: 6,
        incoming: { kind: 'main-switch', ratingA: 63 },
        ways: [distributionWay('b-sub')],
      },
    };
    t.boards.push(a as never, b as never);
    const issues = issuesOf(t);
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatch(
      /boards cannot feed each other in a loop: (Store board feeds Yard board feeds Store board|Yard board feeds Store board feeds Yard board)/,
    );
  });

  it('refuses a board fed from one of its own ways', () => {
    const t = twoLevel();
    t.boards[1].board.ways.push(distributionWay('f-self') as never);
    t.boards[1].feed = { from: 'way', boardId: 'fin', wayId: 'f-self' };
    expect(issuesOf(t)).toEqual(['boards.1.feed.boardId: Finishing room board cannot be fed from one of its own ways']);
  });

  it('refuses a board fed from a way of a board on another site', () => {
    const t = twoLevel();
    t.boards[0].siteId = 'another-site';
    const issues = issuesOf(t);
    expect(issues).toContain('boards.0.siteId: Workshop DB1 is not a board of this site');
    expect(issues).toContain(
      'boards.1.feed.boardId: Finishing room board cannot be fed from Workshop DB1: Workshop DB1 is on another site',
    );
  });

  it('refuses a board fed from a board the site does not have', () => {
    const t = twoLevel();
    t.boards[1].feed = { from: 'way', boardId: 'nowhere', wayId: 'w-sub' };
    expect(issuesOf(t)).toEqual([
      'boards.1.feed.boardId: Finishing room board is fed from a board that is not on this site',
    ]);
  });

  it('refuses a feeding way that is missing, not a sub-main, or already feeds a board', () => {
    const t = twoLevel();
    t.boards[1].feed = { from: 'way', boardId: 'db1', wayId: 'no-such-way' };
    expect(issuesOf(t)).toEqual([
      'boards.1.feed.wayId: Finishing room board is fed from a way that Workshop DB1 does not have',
    ]);

    const u = twoLevel();
    u.boards[1].feed = { from: 'way', boardId: 'db1', wayId: 'w-bench' };
    expect(issuesOf(u)).toEqual([
      'boards.1.feed.wayId: way 2 of Workshop DB1 feeds Finishing room board, so its use must be distribution',
    ]);

    const v = twoLevel();
    v.boards.push({ ...v.boards[1], id: 'fin2', name: 'Spray booth board' });
    expect(issuesOf(v)).toEqual([
      'boards.2.feed.wayId: way 1 of Workshop DB1 already feeds Finishing room board; a way feeds one board',
    ]);
  });

  it('refuses a three-phase board on a single-phase way and a single-phase board on a three-phase way', () => {
    const t = threeLevel();
    t.boards[2].board.phases = 3;
    expect(issuesOf(t)[0]).toBe(
      'boards.2.feed.wayId: Finishing room board is three-phase: it needs a three-phase sub-main, and way 2L3 of Machine shop board is single-phase',
    );
    const u = threeLevel();
    u.boards[1].board = {
      ...u.boards[1].board,
      phases: 1,
      ways: [fixedWay('m-x', 100, 6, 5), distributionWay('m-fin')],
    } as never;
    expect(issuesOf(u)[0]).toBe(
      'boards.1.feed.wayId: Machine shop board is single-phase: feed it from a single-phase way (one phase of Workshop DB1), not from the three-phase way 1L1–L3',
    );
  });

  it('names a bad field of a board through the engine’s schema, and a bad origin', () => {
    const t = twoLevel();
    (t.boards[1].board.ways[0].circuit as { lengthM: number }).lengthM = -3;
    const issues = issuesOf(t);
    expect(issues.some((i) => i.startsWith('boards.1.board.ways.0.circuit.lengthM: Finishing room board: '))).toBe(
      true,
    );
    const u = twoLevel();
    u.origin.uoV = 400;
    expect(issuesOf(u).some((i) => i.startsWith('origin.uoV: ') && i.includes('line-to-earth'))).toBe(true);
  });

  it('a single-phase board on a three-phase board takes the way’s phase from its position when the device has none', () => {
    const t = threeLevel();
    const way = t.boards[1].board.ways[3] as { device: { phase?: string } };
    delete way.device.phase;
    const s = sizeSite(t);
    expect(s.boards.find((b) => b.boardId === 'fin')?.phase).toBe('L3');
  });
});
