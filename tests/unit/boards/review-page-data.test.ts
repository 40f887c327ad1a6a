import { describe, expect, it } from 'vitest';

import { reviewPageData, reviewSizingOf, wayChecksOf } from '@/lib/boards/review-page-data';
import type { ReviewData } from '@/lib/boards/review-types';
import { boardInputSchema, sizeBoard } from '@/lib/sizing';

import { FLAT_SUPPLY } from '../sizing/helpers';

const te = { cable: 'te-70', method: 'C', ambientC: 30, csaMm2: null, phases: 1 };

// A small invented board: a main switch, an RCD, one lighting circuit and a spare
const ways = [
  { id: 'main', device: { kind: 'main-switch', poles: 2, modules: 2 }, circuit: null },
  { id: 'rcd1', device: { kind: 'rcd', poles: 2, modules: 2, rcdMa: 30, ratingA: 63 }, circuit: null },
  {
    id: 'lights',
    device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 6 },
    circuit: {
      ...te,
      use: 'lighting',
      serves: 'Landing lights',
      lengthM: 20,
      load: { kind: 'known', watts: 460, powerFactor: 1 },
    },
  },
  { id: 'spare', device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 16 }, circuit: null },
];
const sizing = sizeBoard(
  boardInputSchema.parse({
    supply: FLAT_SUPPLY,
    phases: 1,
    enclosureModules: 12,
    dwelling: true,
    incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: 100 },
    ways,
  }),
);

const comment = (id: string, wayId: string | null) => ({
  id,
  wayId,
  revision: 1,
  body: `comment ${id}`,
  authorName: 'A. Inspector',
  createdAt: '2026-11-30T10:00:00.000Z',
  answeredAt: null,
});
const review = {
  board: { ways },
  sizing,
  sizingIssues: [],
  comments: [comment('c1', 'lights'), comment('c2', null), comment('c3', 'lights')],
  revisions: [],
  refs: { rcd1: null, lights: '1', spare: '2' },
} as unknown as ReviewData;

describe('reviewPageData: the review cut to the rows and summary the page shows', () => {
  const page = reviewPageData(review);
  const row = (id: string) => page.rows.find((r) => r.id === id)!;

  it("gives every way a row, in the board's order, with the sized way's figures as the engine gave them", () => {
    expect(page.rows.map((r) => r.id)).toEqual(['main', 'rcd1', 'lights', 'spare']);
    const full = sizing.ways.find((w) => w.id === 'lights')!.result!;
    expect(row('lights')).toMatchObject({
      ref: '1',
      serves: 'Landing lights',
      sized: true,
      verdict: full.verdict,
      figures: [
        full.ibA.toFixed(1),
        String(full.csaMm2),
        full.izA!.toFixed(1),
        // A board fed from the origin: the limit as the engine set it, whole (3 % for lighting)
        `${full.vdPct!.toFixed(2)} (${full.vdLimitPct})`,
        `${full.zsOhm!.toFixed(2)} (${full.zsMaxOhm!.toFixed(2)})`,
      ],
    });
    // The device is named with the rating the engine chose when the way has none of its own
    expect(row('lights').device).toBe('MCB B6');
    expect(page.summary!.counts).toEqual(sizing.summary.counts);
    expect(page.summary!.incomingCheck.message).toBe(sizing.summary.incomingCheck.message);
  });

  it("lists the board's checks that fail, in the engine's words, and none when all hold", () => {
    expect(page.summary!.failing).toEqual([]);
    // A full enclosure and a drawn main switch that is not the incoming one (lib/sizing/board.ts)
    const failing = sizeBoard(
      boardInputSchema.parse({
        supply: FLAT_SUPPLY,
        phases: 1,
        enclosureModules: 4,
        dwelling: true,
        incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: 100 },
        ways: ways.map((w) => (w.id === 'main' ? { ...w, device: { ...w.device, ratingA: 80 } } : w)),
      }),
    );
    const messages = failing.summary.checks.filter((c) => !c.ok).map((c) => c.message);
    expect(messages).toHaveLength(2);
    expect(reviewPageData({ ...review, sizing: failing }).summary!.failing).toEqual(messages);
  });

  it('gives a board fed from another the volt drop limit its sub-mains left, to two decimals', () => {
    // Sub-mains above that used 0.803 % leave a lighting circuit 3 − 0.803 = 2.197 % of the
    // origin's 3 % (BS 7671:2018 Appendix 4 Table 4Ab: 3 % lighting, 5 % other uses)
    const fed = sizeBoard(
      boardInputSchema.parse({
        supply: { ...FLAT_SUPPLY, vdUsedPct: 0.803 },
        phases: 1,
        enclosureModules: 12,
        dwelling: true,
        incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: 100 },
        ways,
      }),
    );
    const lights = reviewPageData({ ...review, sizing: reviewSizingOf(fed) }).rows.find((r) => r.id === 'lights')!;
    expect(lights.figures[3]).toMatch(/^\d+\.\d\d \(2\.20\)$/);
  });

  it('shows a way without a circuit as no circuit, with dashes for the figures and no verdict', () => {
    expect(row('spare')).toMatchObject({ ref: '2', serves: null, loadType: null, sized: false, verdict: null });
    expect(row('spare').figures).toEqual(['—', '—', '—', '—', '—']);
    expect(row('main').ref).toBe('');
  });

  it("puts each way's comments on its row, oldest first, and leaves the board's own comments out of the rows", () => {
    expect(row('lights').comments.map((c) => c.id)).toEqual(['c1', 'c3']);
    expect(page.rows.flatMap((r) => r.comments).map((c) => c.id)).not.toContain('c2');
    expect(page.comments.map((c) => c.id)).toEqual(['c1', 'c2', 'c3']);
  });

  it("leaves the engine's working on the server: no sizing, factors, table rows or checks in what the page gets", () => {
    expect(page).not.toHaveProperty('sizing');
    const sent = JSON.stringify(page.rows);
    for (const word of ['factors', 'tableRow', 'checks', 'rcdCoverage']) expect(sent).not.toContain(word);
    expect(page.summary).not.toHaveProperty('rcdCoverage');
  });

  it("a way's checks as the page shows them on opening it: each check's words, nothing of the working", () => {
    const full = sizing.ways.find((w) => w.id === 'lights')!.result!;
    expect(wayChecksOf(full)).toEqual(
      full.checks.map((c) => ({ code: c.code, ok: c.ok, message: c.message, reference: c.reference })),
    );
    expect(full.checks.length).toBeGreaterThan(0);
    expect(wayChecksOf(null)).toEqual([]);
  });

  it('passes a board the engine refused through as not sized, every way without figures', () => {
    const refused = reviewPageData({ ...review, sizing: null });
    expect(refused.summary).toBeNull();
    expect(row('lights').sized).toBe(true);
    expect(refused.rows.find((r) => r.id === 'lights')).toMatchObject({ sized: false, verdict: null });
  });
});
