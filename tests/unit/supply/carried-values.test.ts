import { describe, expect, it } from 'vitest';

import { sizeBoard } from '@/lib/sizing';
import { sizeSite, type SiteBoardResult, type SiteResult } from '@/lib/supply';

import { threeLevel, twoLevel } from './fixtures';

// Every expected value below is worked by hand from the named source, so it can be redone.
// Resistances: IEC 60228 at 20 °C (BS 7671 Table I1 lists the same values): 2.5 mm² 7.41,
// 1.5 mm² 12.1, 4 mm² 4.61, 10 mm² 1.83, 16 mm² 1.15 mΩ/m. Temperature multipliers 1.20 (70 °C
// thermoplastic) and 1.28 (90 °C thermosetting): BS 7671 Appendix 3 practice.
// Rules: "sizeSite rule n" is the numbered rule of the method that sizeSite's comment states
// (lib/supply/size-site.ts): 1 Zdb, 2 fault current, 3 volt drop used, 4 the sub-main's design
// current, 5 selectivity, 6 each board sized with the carried values.

const board = (site: SiteResult, id: string): SiteBoardResult => {
  const b = site.boards.find((x) => x.boardId === id);
  if (!b) throw new Error(`no board ${id}`);
  return b;
};

describe('two levels: Workshop DB1 feeds the Finishing room board', () => {
  const site = sizeSite(twoLevel());
  const db1 = board(site, 'db1');
  const fin = board(site, 'fin');

  it('puts the parent before the child, at depths 0 and 1', () => {
    expect(site.boards.map((b) => [b.boardId, b.depth])).toEqual([
      ['db1', 0],
      ['fin', 1],
    ]);
    expect(fin.fedFrom).toMatchObject({ boardName: 'Workshop DB1', wayLabel: '1', device: 'MCB C32' });
    expect(fin.fedFrom?.cable).toBe('10 mm² armoured thermosetting, 20 m, reference method C');
  });

  it('at the first board the origin values hold (sizeSite rule 1: Zdb = Ze)', () => {
    expect(db1.zdb?.value).toBe(0.35);
    expect(db1.pfc?.value).toBe(1.5);
    expect(db1.vdUsed?.value).toBe(0);
    expect(db1.supply).toEqual({ earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' });
  });

  it('the sub-main design current is the finishing room maximum demand (sizeSite rule 4)', () => {
    // Ib: 2300 / 230 = 10 A and 1150 / 230 = 5 A. Not a dwelling: 100 % of the largest + 75 % of
    // the others (the engine's assumption for a non-dwelling, common practice): 10 + 0.75 · 5 = 13.75 A.
    expect(fin.subMainCurrent?.maxDemandA).toBeCloseTo(13.75, 9);
    expect(fin.subMainCurrent?.value).toBeCloseTo(13.75, 9);
    expect(fin.subMainCurrent?.override).toBeNull();
    const subWay = db1.sizing?.ways.find((w) => w.id === 'w-sub')?.result;
    expect(subWay?.ibA).toBeCloseTo(13.75, 9);
    // The parent's demand carries the sub-main at 100 % (the board below applied its diversity)
    // plus the bench's 920 / 230 = 4 A: 17.75 A.
    expect(db1.sizing?.summary.maxDemandA).toBeCloseTo(17.75, 9);
  });

  it('Zdb at the finishing room (sizeSite rule 1)', () => {
    // 10 mm² armoured 3-core, single-phase: the cpc is a spare 10 mm² core (the engine's default).
    // R1+R2 = (1.83 + 1.83) mΩ/m × 20 m × 1.28 = 0.093696 Ω; Zdb = 0.35 + 0.093696 = 0.443696 Ω.
    expect(fin.zdb?.value).toBeCloseTo(0.443696, 6);
    expect(fin.zdb?.working.text).toContain('0.444 Ω');
    expect(fin.zdb?.working.steps.join(' ')).toContain('1.830');
  });

  it('prospective fault current at the finishing room (sizeSite rule 2)', () => {
    // Zsrc = 230 / 1500 = 0.153333 Ω. Line–neutral loop, cold: (1.83 + 1.83) × 20 / 1000 = 0.0732 Ω.
    // Isc = 230 / (0.153333 + 0.0732) = 1015.30 A.
    // Earth fault, cold: Zcold = 0.35 + 0.0732 = 0.4232 Ω → 230 / 0.4232 = 543.48 A.
    // Ipf = the larger: 1015.30 A = 1.01530 kA.
    expect(fin.pfc?.shortCircuitKa).toBeCloseTo(1.0153, 4);
    expect(fin.pfc?.earthFaultKa).toBeCloseTo(0.54348, 4);
    expect(fin.pfc?.value).toBeCloseTo(1.0153, 4);
    expect(fin.pfc?.working.text).toMatch(/reactance neglected/);
  });

  it('volt drop used above the finishing room (sizeSite rule 3)', () => {
    // Table 4E4B two-core 10 mm²: 4.7 mV/A/m (confirmed). 4.7 × 13.75 × 20 / 1000 = 1.2925 V;
    // 1.2925 / 230 = 0.561957 %.
    expect(fin.vdUsed?.value).toBeCloseTo(0.561957, 5);
    expect(fin.supply?.vdUsedPct).toBeCloseTo(0.561957, 5);
  });

  it('the finishing room ways are sized with the carried values', () => {
    // Spray booth: 2.5 mm² twin and earth (cpc 1.5 mm²), 10 m: R1+R2 = (7.41 + 12.1) × 10 × 1.20 / 1000
    // = 0.23412 Ω; Zs = 0.443696 + 0.23412 = 0.677816 Ω. VD limit = 5 − 0.561957 = 4.438043 %.
    const spray = fin.sizing?.ways.find((w) => w.id === 'f-spray')?.result;
    expect(spray?.zsOhm).toBeCloseTo(0.677816, 6);
    expect(spray?.vdLimitPct).toBeCloseTo(4.438043, 5);
    // The same board with those values typed in gives the same result.
    expect(sizeBoard({ ...fin.sizedInput!, supply: { ...fin.supply! } })).toEqual(fin.sizing);
  });

  it('selectivity: C32 above B16 and B10 is selective up to 5 × 32 = 160 A (sizeSite rule 5)', () => {
    // Breaker above breaker: up to the upper breaker's lowest instantaneous trip, 5·In for type C
    // (BS EN 60898-1 bands, common practice); the fault current at the board, 1015 A, is above it.
    const oc = fin.selectivity.filter((p) => p.kind === 'overcurrent');
    expect(oc.map((p) => [p.downstream, p.outcome, p.upToA])).toEqual([
      ['MCB B16, way 1', 'selective-up-to', 160],
      ['MCB B10, way 2', 'selective-up-to', 160],
    ]);
    expect(oc.every((p) => p.advisory)).toBe(true);
    // Advisory only: the ways pass, so the board's worst verdict is near limit, not fails.
    expect(fin.sizing?.summary.counts.fails).toBe(0);
    expect(fin.worstVerdict).toBe('near-limit');
  });

  it('an override replaces the design current, with its reason in the working', () => {
    const input = twoLevel();
    const f = input.boards[1].feed;
    if (f.from === 'way') f.designCurrentOverride = { amps: 25, reason: 'a spray booth heater is planned' };
    const s = sizeSite(input);
    const fin2 = board(s, 'fin');
    expect(fin2.subMainCurrent?.value).toBe(25);
    expect(fin2.subMainCurrent?.maxDemandA).toBeCloseTo(13.75, 9);
    expect(fin2.subMainCurrent?.working.text).toContain('a spray booth heater is planned');
    // 4.7 × 25 × 20 / 1000 = 2.35 V = 1.021739 %.
    expect(fin2.vdUsed?.value).toBeCloseTo(1.021739, 5);
  });
});

describe('three levels: Workshop DB1 → Machine shop board (three-phase) → Finishing room board (L3)', () => {
  const site = sizeSite(threeLevel());
  const ms = board(site, 'ms');
  const fin = board(site, 'fin');

  it('orders the boards and takes the way’s phase for the single-phase board', () => {
    expect(site.boards.map((b) => [b.boardId, b.depth])).toEqual([
      ['db1', 0],
      ['ms', 1],
      ['fin', 2],
    ]);
    expect(fin.phase).toBe('L3');
    expect(fin.fedFrom?.wayLabel).toBe('2L3');
    expect(ms.phase).toBeNull();
  });

  it('design currents: the most loaded phase of the machine shop (sizeSite rule 4)', () => {
    // Finishing room: 2300 / 230 = 10 A. Machine shop: panel saw 4000 / (√3 × 400 × 0.85) = 6.7924 A
    // on every phase (100 %, the largest "other" circuit), the sub-main 10 A on L3 at 100 %:
    // L3 = 16.7924 A, the most loaded phase.
    expect(fin.subMainCurrent?.value).toBeCloseTo(10, 9);
    expect(ms.subMainCurrent?.value).toBeCloseTo(16.7924, 4);
  });

  it('Machine shop board: Zdb through armour as cpc, three-phase fault current, volt drop', () => {
    // 16 mm² four-core armoured: the armour is the cpc (engine default for three-phase), 3.5 mΩ/m at
    // 20 °C (BS 5467 four-core 16 mm², from memory), taken at 80 °C × 1.27; the line at 90 °C × 1.28.
    // R1+R2 = (1.15 × 1.28 + 3.5 × 1.27) × 30 / 1000 = (1.472 + 4.445) × 0.03 = 0.17751 Ω.
    // Zdb = 0.2 + 0.17751 = 0.37751 Ω.
    expect(ms.zdb?.value).toBeCloseTo(0.37751, 5);
    // Zsrc = 230 / 6000 = 0.038333 Ω; three-phase symmetrical: 230 / (0.038333 + 1.15 × 30 / 1000)
    // = 230 / 0.072833 = 3157.89 A. Earth fault cold: 0.2 + (1.15 + 3.5) × 0.03 = 0.3395 Ω → 677.47 A.
    expect(ms.pfc?.shortCircuitKa).toBeCloseTo(3.15789, 4);
    expect(ms.pfc?.earthFaultKa).toBeCloseTo(0.67747, 4);
    expect(ms.pfc?.value).toBeCloseTo(3.15789, 4);
    // Table 4E4B four-core 16 mm²: 2.5 mV/A/m. 2.5 × 16.7924 × 30 / 1000 = 1.25943 V of 400 V = 0.314858 %.
    expect(ms.vdUsed?.value).toBeCloseTo(0.314858, 5);
  });

  it('Finishing room board: values carried through two sub-mains', () => {
    // 4 mm² twin and earth has a 1.5 mm² cpc (Table 4D5 construction).
    // R1+R2 = (4.61 + 12.1) × 15 × 1.20 / 1000 = 0.30078 Ω; Zdb = 0.37751 + 0.30078 = 0.67829 Ω.
    expect(fin.zdb?.value).toBeCloseTo(0.67829, 5);
    // Zsrc = 230 / 3157.89 = 0.072833 Ω; single-phase: 230 / (0.072833 + 2 × 4.61 × 15 / 1000)
    // = 230 / 0.211133 = 1089.36 A. Earth fault cold: 0.3395 + (4.61 + 12.1) × 0.015 = 0.59015 Ω → 389.73 A.
    expect(fin.pfc?.shortCircuitKa).toBeCloseTo(1.08936, 4);
    expect(fin.pfc?.earthFaultKa).toBeCloseTo(0.38973, 4);
    expect(fin.pfc?.value).toBeCloseTo(1.08936, 4);
    // Table 4D5 4 mm²: 11 mV/A/m (from memory). 11 × 10 × 15 / 1000 = 1.65 V = 0.717391 %;
    // used above: 0.314858 + 0.717391 = 1.032249 %.
    expect(fin.vdUsed?.value).toBeCloseTo(1.032249, 5);
    const spray = fin.sizing?.ways.find((w) => w.id === 'f-spray')?.result;
    // Zs = 0.67829 + 0.23412 = 0.91241 Ω; VD limit 5 − 1.032249 = 3.967751 %.
    expect(spray?.zsOhm).toBeCloseTo(0.91241, 5);
    expect(spray?.vdLimitPct).toBeCloseTo(3.967751, 5);
  });

  it('selectivity of each sub-main against the devices below it (sizeSite rule 5)', () => {
    // 63 A fuse above the 16 A fuse: 63 ≥ 1.6 × 16 = 25.6 → selective throughout (gG ratio, from memory).
    // 63 A fuse above the C20: the fuse's pre-arcing I²t is not held → cannot be judged.
    expect(ms.selectivity.map((p) => [p.downstream, p.outcome])).toEqual([
      ['BS 88-2 fuse 16 A, way 1L1–L3', 'selective'],
      ['MCB C20, way 2L3', 'cannot-judge'],
    ]);
    // C20 above the B16: selective up to 5 × 20 = 100 A; the fault current at the board is 1089 A.
    expect(fin.selectivity.map((p) => [p.downstream, p.outcome, p.upToA])).toEqual([
      ['MCB B16, way 1', 'selective-up-to', 100],
    ]);
  });
});
