import { describe, expect, it } from 'vitest';

import {
  ambientFactor,
  cableRows,
  groupingFactor,
  insulationFactor,
  maxZs,
  methodsFor,
  r1r2PerMetre,
  STANDARD_RATINGS_A,
} from '@/lib/sizing';
import { AMBIENT_CA } from '@/lib/sizing/tables/ambient';
import { ARMOURED_4E4 } from '@/lib/sizing/tables/armoured-4e4';
import { COPPER_R20_MOHM_PER_M } from '@/lib/sizing/tables/conductor-resistance';
import { FUSE_MAX_ZS_OHM } from '@/lib/sizing/tables/max-zs';
import { MULTICORE_4D2 } from '@/lib/sizing/tables/multicore-4d2';
import { SINGLE_CORE_4D1 } from '@/lib/sizing/tables/single-core-4d1';
import { TWIN_AND_EARTH_4D5 } from '@/lib/sizing/tables/twin-and-earth-4d5';
import { CABLE_KINDS, type CableKind } from '@/lib/sizing/types';

const r20 = COPPER_R20_MOHM_PER_M as Record<number, number>;

describe('max Zs for circuit-breakers against the printed BS 7671:2018 Table 41.3', () => {
  // Printed values (BS 7671:2018 Table 41.3, 0.4 s and 5 s, Uo 230 V, Cmin 0.95).
  const printed: Array<['B' | 'C' | 'D', number, number]> = [
    ['B', 6, 7.28],
    ['B', 10, 4.37],
    ['B', 16, 2.73],
    ['B', 20, 2.19],
    ['B', 32, 1.37],
    ['B', 40, 1.09],
    ['C', 20, 1.09],
    ['C', 32, 0.68],
    ['D', 20, 0.55],
  ];
  it.each(printed)('%s%i is %f Ω to two decimals', (curve, inA, zs) => {
    const got = maxZs({ kind: 'mcb', curve, inA }, 0.4, 230);
    expect(got).not.toBeNull();
    expect(Math.abs((got ?? 0) - zs)).toBeLessThanOrEqual(0.005 + 1e-9);
  });
  it('does not use the first-printed 2008 values (B32 1.44 Ω, B6 7.67 Ω)', () => {
    expect(maxZs({ kind: 'mcb', curve: 'B', inA: 32 }, 0.4, 230)).toBeLessThan(1.4);
    expect(maxZs({ kind: 'mcb', curve: 'B', inA: 6 }, 0.4, 230)).toBeLessThan(7.5);
  });
});

describe('fuse max Zs tables (from memory) obey the physics of a time-current curve', () => {
  // A fuse needs more current to blow in 0.4 s than in 5 s, so its 0.4 s max Zs is lower; and a
  // larger fuse needs more current, so max Zs falls as the rating rises.
  for (const [kind, cols] of Object.entries(FUSE_MAX_ZS_OHM)) {
    it(`${kind}: Zs(0.4 s) < Zs(5 s) and both fall with rating`, () => {
      const z04 = cols['0.4'] as Record<number, number>;
      const z5 = cols['5'] as Record<number, number>;
      for (const [r, z] of Object.entries(z04)) expect(z).toBeLessThan(z5[Number(r)]);
      for (const col of [z04, z5]) {
        const ratings = Object.keys(col)
          .map(Number)
          .sort((a, b) => a - b);
        for (let i = 1; i < ratings.length; i++) expect(col[ratings[i]]).toBeLessThan(col[ratings[i - 1]]);
      }
    });
  }
});

describe('ambient factor Ca against the published formula', () => {
  // Above 30 °C: Ca = √((θp − θa)/(θp − 30)) (IEC 60364-5-52 basis). At 25 °C, for cables with
  // overload protection: Ca = (1/1.45)·√((θo − θa)/(θp − 30)), θo = 30 + 1.45²·(θp − 30)
  // (BS 7671 Table 4B1; the IEC table's 1.06 and 1.04 at 25 °C are for cables without overload
  // protection). Printed to two decimals, so within 0.006.
  for (const thetaP of [70, 90] as const) {
    it(`${thetaP} °C cable`, () => {
      for (const [t, ca] of AMBIENT_CA[thetaP]) {
        let formula: number;
        if (t < 30) {
          const thetaO = 30 + 1.45 ** 2 * (thetaP - 30);
          formula = (1 / 1.45) * Math.sqrt((thetaO - t) / (thetaP - 30));
        } else {
          formula = Math.sqrt((thetaP - t) / (thetaP - 30));
        }
        expect(Math.abs(ca - formula)).toBeLessThan(0.006);
      }
    });
  }
  it('uses the next higher tabulated temperature and 25 °C below it', () => {
    expect(ambientFactor(31, 70)).toBe(0.94);
    expect(ambientFactor(10, 70)).toBe(1.03);
    expect(ambientFactor(10, 90)).toBe(1.02);
    expect(ambientFactor(61, 70)).toBeNull();
  });
});

describe('grouping factor Cg against the printed BS 7671 Table 4C1 rows', () => {
  it('bunched row 1–9, 12, 16, 20', () => {
    const printed = [1.0, 0.8, 0.7, 0.65, 0.6, 0.57, 0.54, 0.52, 0.5];
    printed.forEach((cg, i) => expect(groupingFactor(i + 1, 'bunched')).toBe(cg));
    expect(groupingFactor(12, 'bunched')).toBe(0.45);
    expect(groupingFactor(16, 'bunched')).toBe(0.41);
    expect(groupingFactor(20, 'bunched')).toBe(0.38);
  });
  it('single layer touching row 1–9, then 0.70', () => {
    const printed = [1.0, 0.85, 0.79, 0.75, 0.73, 0.72, 0.72, 0.71, 0.7];
    printed.forEach((cg, i) => expect(groupingFactor(i + 1, 'single-layer')).toBe(cg));
    expect(groupingFactor(30, 'single-layer')).toBe(0.7);
  });
  it('takes the next higher count between columns (10 → 12 → 0.45)', () => {
    expect(groupingFactor(10, 'bunched')).toBe(0.45);
    expect(groupingFactor(13, 'bunched')).toBe(0.41);
  });
});

describe('thermal insulation factor Ci (BS 7671 Table 52.2)', () => {
  it('confirmed cells 100 mm 0.78 and ≥ 500 mm 0.50; next longer length; none for 100–103', () => {
    expect(insulationFactor(100, 'C')).toBe(0.78);
    expect(insulationFactor(500, 'C')).toBe(0.5);
    expect(insulationFactor(2000, 'C')).toBe(0.5);
    expect(insulationFactor(101, 'C')).toBe(0.63);
    expect(insulationFactor(0, 'C')).toBe(1);
    expect(insulationFactor(300, '103')).toBe(1);
  });
});

describe('mV/A/m against 2·r20·1.20 (or ·1.28) from IEC 60228, sizes up to 16 mm²', () => {
  // Resistance dominates for small sizes: single-phase mV/A/m ≈ 2·r20·θ-factor, three-phase
  // ≈ √3·r20·θ-factor. Tolerance 3 % (the tables are printed to two significant figures).
  const cases: Array<[string, readonly number[], readonly number[], readonly number[] | null, number]> = [
    ['4D5', TWIN_AND_EARTH_4D5.sizesMm2, TWIN_AND_EARTH_4D5.mvAm1, null, 1.2],
    ['4D1B', SINGLE_CORE_4D1.sizesMm2, SINGLE_CORE_4D1.mvAm1, SINGLE_CORE_4D1.mvAm3, 1.2],
    ['4D2B', MULTICORE_4D2.sizesMm2, MULTICORE_4D2.mvAm1, MULTICORE_4D2.mvAm3, 1.2],
    ['4E4B', ARMOURED_4E4.sizesMm2, ARMOURED_4E4.mvAm1, ARMOURED_4E4.mvAm3, 1.28],
  ];
  it.each(cases)('Table %s', (_name, sizes, mv1, mv3, factor) => {
    sizes.forEach((s, i) => {
      if (s > 16) return;
      const single = 2 * r20[s] * factor;
      expect(Math.abs(mv1[i] - single) / single).toBeLessThan(0.03);
      if (mv3) {
        const three = Math.sqrt(3) * r20[s] * factor;
        expect(Math.abs(mv3[i] - three) / three).toBeLessThan(0.03);
      }
    });
  });
  it('above 16 mm² the tabulated impedance is never below the resistance alone', () => {
    for (const t of [SINGLE_CORE_4D1, MULTICORE_4D2, ARMOURED_4E4]) {
      const f = t === ARMOURED_4E4 ? 1.28 : 1.2;
      t.sizesMm2.forEach((s, i) => {
        if (s > 16) expect(t.mvAm1[i]).toBeGreaterThanOrEqual(2 * r20[s] * f * 0.97);
      });
    }
  });
});

describe('R1+R2 per metre against the sums of IEC 60228 values', () => {
  // Published R1+R2 at 20 °C, mΩ/m: 1.5/1.0 30.2, 2.5/1.5 19.51, 4/1.5 16.71, 6/2.5 10.49, 10/4 6.44, 16/6 4.23.
  const sums: Array<[number, number, number]> = [
    [1.5, 1, 30.2],
    [2.5, 1.5, 19.51],
    [4, 1.5, 16.71],
    [6, 2.5, 10.49],
    [10, 4, 6.44],
    [16, 6, 4.23],
  ];
  it.each(sums)('%f/%f mm² is %f mΩ/m at 20 °C, ×1.20 at 70 °C and ×1.28 at 90 °C', (l, c, sum) => {
    expect(((r1r2PerMetre(l, c, 70) ?? 0) * 1000) / 1.2).toBeCloseTo(sum, 6);
    expect((r1r2PerMetre(l, c, 70) ?? 0) * 1000).toBeCloseTo(sum * 1.2, 6);
    expect((r1r2PerMetre(l, c, 90) ?? 0) * 1000).toBeCloseTo(sum * 1.28, 6);
  });
});

describe('current ratings: confirmed cells and physical ordering', () => {
  it('confirmed cells of Tables 4D5, 4D1A and 4D2A (each table’s header says which cells)', () => {
    const te = (m: '100' | '101' | '102' | '103' | 'C' | 'A', s: number) =>
      cableRows('te-70', m, 1)?.find((r) => r.csaMm2 === s)?.itA;
    expect([te('100', 1), te('101', 1), te('102', 1), te('103', 1), te('C', 1), te('A', 1)]).toEqual([
      13, 10.5, 13, 8, 16, 11.5,
    ]);
    expect([te('100', 1.5), te('101', 1.5), te('102', 1.5), te('103', 1.5), te('C', 1.5), te('A', 1.5)]).toEqual([
      16, 13, 16, 10, 20, 14.5,
    ]);
    expect(te('C', 2.5)).toBe(27);
    expect(te('100', 4)).toBe(27);
    const sc = (m: 'A' | 'B' | 'C', p: 1 | 3, s: number) =>
      cableRows('single-pvc-70', m, p)?.find((r) => r.csaMm2 === s)?.itA;
    expect([sc('A', 1, 25), sc('A', 3, 25), sc('B', 1, 25), sc('B', 3, 25), sc('C', 1, 25), sc('A', 1, 10)]).toEqual([
      80, 73, 101, 89, 114, 46,
    ]);
    const mc = cableRows('multi-pvc-70', 'C', 3);
    expect(mc?.find((r) => r.csaMm2 === 4)).toMatchObject({ itA: 32, mvAm: 9.5 });
    expect(mc?.find((r) => r.csaMm2 === 10)).toMatchObject({ itA: 57, mvAm: 3.8 });
  });
  it('ratings rise with size while current density falls, in every column', () => {
    for (const cable of CABLE_KINDS as readonly CableKind[]) {
      for (const m of methodsFor(cable)) {
        for (const p of [1, 3] as const) {
          const rows = cableRows(cable, m, p);
          if (!rows) continue;
          for (let i = 1; i < rows.length; i++) {
            expect(rows[i].itA).toBeGreaterThan(rows[i - 1].itA);
            expect(rows[i].itA / rows[i].csaMm2).toBeLessThan(rows[i - 1].itA / rows[i - 1].csaMm2);
            expect(rows[i].mvAm).toBeLessThan(rows[i - 1].mvAm);
          }
        }
      }
    }
  });
  it('three loaded conductors carry less than two; clipped (C) ≥ conduit (B) ≥ insulated wall (A)', () => {
    for (const t of [SINGLE_CORE_4D1.itA, MULTICORE_4D2.itA]) {
      for (const col of Object.values(t) as Array<Record<2 | 3, readonly number[]>>) {
        col[3].forEach((v, i) => expect(v).toBeLessThan(col[2][i]));
      }
      for (const p of [2, 3] as const) {
        t.C[p].forEach((v, i) => expect(v).toBeGreaterThanOrEqual(t.B[p][i]));
        t.B[p].forEach((v, i) => expect(v).toBeGreaterThan(t.A[p][i]));
      }
    }
  });
});

describe('methods and ratings', () => {
  it('method D only for armoured cable; twin and earth has no three-phase column', () => {
    expect(methodsFor('swa-xlpe-90')).toContain('D');
    for (const c of ['te-70', 'single-pvc-70', 'multi-pvc-70'] as const) expect(methodsFor(c)).not.toContain('D');
    expect(cableRows('te-70', 'C', 3)).toBeNull();
    expect(methodsFor('te-70')).toEqual(['100', '101', '102', '103', 'A', 'C']);
  });
  it('breaker ratings are the BS EN 60898 preferred list', () => {
    expect(STANDARD_RATINGS_A.mcb).toEqual([6, 10, 16, 20, 25, 32, 40, 50, 63, 80, 100, 125]);
  });
});
