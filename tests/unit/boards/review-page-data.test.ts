import { describe, expect, it } from 'vitest';

import { reviewPageData, wayChecksOf } from '@/lib/boards/review-page-data';
import type { ReviewData } from '@/lib/boards/review-types';
import { boardInputSchema, sizeBoard } from '@/lib/sizing';

import { FLAT_SUPPLY } from '../sizing/helpers';

const te = { cable: 'te-70', method: 'C', ambientC: 30, csaMm2: null, phases: 1 };

// A small invented board: a main switch, an RCD and one lighting circuit
const sizing = sizeBoard(
  boardInputSchema.parse({
    supply: FLAT_SUPPLY,
    phases: 1,
    enclosureModules: 12,
    dwelling: true,
    incoming: { kind: 'main-switch', ratingA: 100, busbarRatingA: 100 },
    ways: [
      { id: 'main', device: { kind: 'main-switch', poles: 2, modules: 2 }, circuit: null },
      { id: 'rcd1', device: { kind: 'rcd', poles: 2, modules: 2, rcdMa: 30, ratingA: 63 }, circuit: null },
      {
        id: 'lights',
        device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 6 },
        circuit: { ...te, use: 'lighting', lengthM: 20, load: { kind: 'known', watts: 460, powerFactor: 1 } },
      },
    ],
  }),
);

const review = { sizing, sizingIssues: [], comments: [], revisions: [], refs: {} } as unknown as ReviewData;

describe('reviewPageData: the review cut to what the page shows', () => {
  const page = reviewPageData(review);

  it('keeps every way and the figures the table shows, unchanged; the checks load on opening a way', () => {
    expect(page.sizing!.ways.map((w) => w.id)).toEqual(sizing.ways.map((w) => w.id));
    const full = sizing.ways.find((w) => w.id === 'lights')!.result!;
    const cut = page.sizing!.ways.find((w) => w.id === 'lights')!.result!;
    expect(cut).toEqual({
      ibA: full.ibA,
      inA: full.inA,
      csaMm2: full.csaMm2,
      izA: full.izA,
      vdPct: full.vdPct,
      zsOhm: full.zsOhm,
      zsMaxOhm: full.zsMaxOhm,
      verdict: full.verdict,
    });
    expect(cut).not.toHaveProperty('checks');
    expect(page.sizing!.ways.find((w) => w.id === 'main')!.result).toBeNull();
    expect(page.sizing!.summary.counts).toEqual(sizing.summary.counts);
    expect(page.sizing!.summary.incomingCheck.message).toBe(sizing.summary.incomingCheck.message);
  });

  it("leaves the engine's working on the server", () => {
    const cut = page.sizing!.ways.find((w) => w.id === 'lights')!.result!;
    expect(cut).not.toHaveProperty('factors');
    expect(cut).not.toHaveProperty('tableRow');
    expect(page.sizing!.summary).not.toHaveProperty('rcdCoverage');
    expect(JSON.stringify(page.sizing).length).toBeLessThan(JSON.stringify(sizing).length);
  });

  it("a way's checks as the page shows them on opening it: each check's words, nothing of the working", () => {
    const full = sizing.ways.find((w) => w.id === 'lights')!.result!;
    expect(wayChecksOf(full)).toEqual(
      full.checks.map((c) => ({ code: c.code, ok: c.ok, message: c.message, reference: c.reference })),
    );
    expect(full.checks.length).toBeGreaterThan(0);
    expect(wayChecksOf(null)).toEqual([]);
  });

  it('passes a board the engine refused through as not sized', () => {
    expect(reviewPageData({ ...review, sizing: null }).sizing).toBeNull();
  });
});
