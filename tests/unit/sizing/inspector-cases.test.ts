/**
 * Hand calculations an inspector would check, one block per rule the engine got wrong before
 * (the numbered items of "Sizing an inspector would sign"). Each case gives its working and
 * its source; values marked "from memory" come from a table cell not yet seen in print.
 */
import { describe, expect, it } from 'vitest';

import { boardInputSchema, diversityClass, kFactor, sizeBoard, sizeCircuit } from '@/lib/sizing';
import type { CircuitInput } from '@/lib/sizing';

import { checkOf, circuit, FLAT_SUPPLY } from './helpers';

type Loose = Record<string, unknown>;

const te = { cable: 'te-70', ambientC: 30, csaMm2: null, phases: 1 };
const known = (watts: number, powerFactor = 1) => ({ kind: 'known', watts, powerFactor });

/** A raw (unparsed) input, as a direct caller would pass it. */
const raw = (supply: Loose, c: Loose) => ({ supply, circuit: c }) as unknown as CircuitInput;

describe('1. the engine guards itself', () => {
  const good = {
    ...te,
    use: 'fixed',
    method: 'C',
    lengthM: 10,
    load: known(3000),
    device: { kind: 'mcb', curve: 'B', ratingA: null },
  };

  it('a direct call with a negative length throws, naming the field (no negative volt drop or Zs)', () => {
    expect(() => sizeCircuit(raw(FLAT_SUPPLY, { ...good, lengthM: -12 }))).toThrow(/circuit\.lengthM/);
  });

  it('any other input the schema refuses throws too: unknown fields, bad enums, NaN', () => {
    expect(() => sizeCircuit(raw(FLAT_SUPPLY, { ...good, colour: 'red' }))).toThrow(/circuit/);
    expect(() => sizeCircuit(raw(FLAT_SUPPLY, { ...good, method: 'Z' }))).toThrow(/circuit\.method/);
    expect(() => sizeCircuit(raw({ ...FLAT_SUPPLY, zeOhm: Number.NaN }, good))).toThrow(/supply\.zeOhm/);
  });

  it('sizeBoard validates its board the same way', () => {
    const board = {
      supply: FLAT_SUPPLY,
      phases: 1,
      enclosureModules: 6,
      incoming: { kind: 'main-switch', ratingA: 100 },
      ways: [
        {
          id: 'a',
          device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 16 },
          circuit: { ...good, lengthM: -1, device: undefined },
        },
      ],
    };
    delete (board.ways[0].circuit as Loose).device;
    expect(() => sizeBoard(board as never)).toThrow(/ways\.0\.circuit\.lengthM/);
  });
});

describe('2. Uo is line-to-earth; three-phase uses UL = 400 V', () => {
  it('refuses Uo = 400 V with a message that says Uo is line-to-earth', () => {
    const c = {
      ...te,
      use: 'fixed',
      method: 'C',
      lengthM: 10,
      load: known(3000),
      device: { kind: 'mcb', curve: 'B', ratingA: null },
    };
    expect(() => sizeCircuit(raw({ ...FLAT_SUPPLY, uoV: 400 }, c))).toThrow(/line-to-earth/);
    expect(() => sizeCircuit(raw({ ...FLAT_SUPPLY, uoV: 99 }, c))).toThrow(/supply\.uoV/);
  });

  it('a 22 kW three-phase load is 31.75 A on a C32, not 20 A on a C25', () => {
    // Ib = P / (√3 · UL · pf) = 22 000 / (1.7321 · 400 · 1) = 31.754 A → C32.
    // Table 4D2A 3-core method C: 4 mm² It 32 ≥ 32. VD = 9.5 mV/A/m (4D2B, confirmed) · 31.754 · 10 / 1000
    //   = 3.0166 V, as a percentage of UL 400 V = 0.7541 %.
    const r = sizeCircuit(
      circuit(FLAT_SUPPLY, {
        phases: 3,
        use: 'fixed',
        load: known(22000),
        lengthM: 10,
        cable: 'multi-pvc-70',
        method: 'C',
        ambientC: 30,
        csaMm2: null,
        device: { kind: 'mcb', curve: 'C', ratingA: null },
      }),
    );
    expect(r.ibA).toBeCloseTo(31.754, 3);
    expect(r.inA).toBe(32);
    expect(r.csaMm2).toBe(4);
    expect(r.vdV).toBeCloseTo(3.0166, 3);
    expect(r.vdPct).toBeCloseTo(0.7541, 3);
  });
});

describe('3. ring final circuits: Iz ≥ 20 A on a 30/32 A device (BS 7671 433.1.204)', () => {
  const ring = (method: string, lengthM = 30) =>
    sizeCircuit(
      circuit(FLAT_SUPPLY, {
        ...te,
        use: 'sockets',
        method,
        lengthM,
        load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 60 },
        device: { kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 },
      }),
    );

  it('2.5 mm² in method 100 (It 21 A ≥ 20 A) passes and is kept, not pushed to 4 mm²', () => {
    // Table 4D5 method 100, 2.5 mm²: 21 A (from memory) ≥ 20 A. VD (ring, load at the midpoint ÷ 4):
    //   18 · 32 · 40 / 1000 / 4 = 5.76 V = 2.504 %. R1+R2 = 19.51 · 1.2 · 40 / 1000 / 4 = 0.23412 Ω,
    //   Zs = 0.35 + 0.23412 = 0.58412 Ω ≤ 0.95 · 230 / 160 = 1.3656 Ω.
    const r = ring('100', 40);
    expect(r.csaMm2).toBe(2.5);
    expect(r.izA).toBe(21);
    expect(checkOf(r, 'cable-capacity')).toMatchObject({ ok: true, reference: expect.stringMatching(/433\.1\.204/) });
    expect(r.vdPct).toBeCloseTo(2.504, 3);
    expect(r.zsOhm).toBeCloseTo(0.58412, 5);
    // The cable carries Ib · 20/In = 20 A against Iz 21 A: within 10 % of its limit.
    expect(r.verdict).toBe('near-limit');
  });

  it('in each method the smallest size with Iz ≥ 20 A (Table 4D5): A 2.5, C 2.5, 101 4, 103 6', () => {
    // A 20 ≥ 20; C 27; 101: 2.5 mm² 17 < 20, 4 mm² 22; 103: 2.5 13.5, 4 17.5, 6 23.5 (from memory).
    expect(ring('A').csaMm2).toBe(2.5);
    expect(ring('C').csaMm2).toBe(2.5);
    expect(ring('101').csaMm2).toBe(4);
    expect(ring('103').csaMm2).toBe(6);
  });

  it('a ring is never 1.5 mm², even where 1.5 mm² would carry 20 A (433.1.204 names 2.5 mm²)', () => {
    // 4D5 method C 1.5 mm²: 20 A ≥ 20 A, yet the regulation's deemed-to-comply ring is 2.5 mm².
    expect(ring('C').csaMm2).toBe(2.5);
    const fixed = sizeCircuit(
      circuit(FLAT_SUPPLY, {
        ...te,
        csaMm2: 1.5,
        use: 'sockets',
        method: 'C',
        lengthM: 20,
        load: { kind: 'socket-arrangement', arrangement: 'ring-32', floorAreaM2: 60 },
        device: { kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 },
      }),
    );
    expect(checkOf(fixed, 'ring-size').ok).toBe(false);
    expect(fixed.verdict).toBe('fails');
  });
});

describe('4. Type D breakers at 5 s use 10·In (BS 7671 Table 41.3)', () => {
  const d = (use: string, ratingA: number) =>
    sizeCircuit(
      circuit(FLAT_SUPPLY, {
        ...te,
        use,
        method: 'C',
        lengthM: 5,
        load: known(2000),
        device: { kind: 'mcb', curve: 'D', ratingA },
      }),
    );

  it('D32 at 5 s (distribution): 0.95 · 230 / 320 = 0.6828 Ω; at 0.4 s: 0.95 · 230 / 640 = 0.3414 Ω', () => {
    expect(d('distribution', 32).disconnectionTimeS).toBe(5);
    expect(d('distribution', 32).zsMaxOhm).toBeCloseTo(0.6828, 4);
    expect(d('fixed', 32).disconnectionTimeS).toBe(0.4);
    expect(d('fixed', 32).zsMaxOhm).toBeCloseTo(0.3414, 4);
  });

  it('a D40 fixed load (over 32 A, so 5 s): 0.95 · 230 / 400 = 0.5463 Ω', () => {
    expect(d('fixed', 40).zsMaxOhm).toBeCloseTo(0.54625, 5);
  });
});

describe('5. the adiabatic check uses the far-end fault current and the operating time there', () => {
  it('a D16 on 15 m of 2.5 mm² at Zs 0.65 Ω passes at 2.5 mm² (not pushed to 6 mm²)', () => {
    // Ze 0.3 Ω. R1+R2 (2.5/1.5) = 19.51 · 1.2 · 15 / 1000 = 0.35118 Ω, Zs = 0.65118 Ω ≤ 0.6828 Ω (D16).
    // I = 230 / 0.65118 = 353.205 A ≥ 20 · 16 = 320 A: the breaker trips within 0.1 s (no let-through data
    //   held for Type D): S = √(353.205² · 0.1) / 115 (Table 54.3) = 0.9713 mm² ≤ 1.5 mm².
    const r = sizeCircuit(
      circuit(
        { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.3, pfcKa: 2, source: 'public' },
        {
          ...te,
          use: 'fixed',
          method: 'C',
          lengthM: 15,
          load: known(2000),
          device: { kind: 'mcb', curve: 'D', ratingA: 16 },
        },
      ),
    );
    expect(r.csaMm2).toBe(2.5);
    expect(r.zsOhm).toBeCloseTo(0.65118, 5);
    expect(r.faultCurrentA).toBeCloseTo(353.205, 2);
    expect(r.adiabaticTimeS).toBe(0.1);
    expect(r.cpcMinMm2).toBeCloseTo(0.9713, 3);
    expect(r.verdict).not.toBe('fails');
  });

  it('a B40 cooker on a stiff supply passes at 6 mm² (the origin current with 0.1 s failed it even at 16 mm²)', () => {
    // Ze 0.05 Ω, PFC 4.6 kA. Ib = 9000 / 230 = 39.13 A → B40; Table 4D5 C: 6 mm² 47 A ≥ 40.
    // R1+R2 (6/2.5) = 10.49 · 1.2 · 20 / 1000 = 0.25176 Ω; Zs = 0.30176 Ω ≤ 1.0925 Ω.
    // I = 230 / 0.30176 = 762.2 A ≥ 200 A: S = 762.2 · √0.1 / 115 = 2.0959 mm² ≤ 2.5 mm².
    //   (At the origin, 4.6 kA · √0.1 / 115 = 12.65 mm²: no twin and earth cpc is that large.)
    const r = sizeCircuit(
      circuit(
        { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.05, pfcKa: 4.6, source: 'public' },
        {
          ...te,
          use: 'fixed',
          method: 'C',
          lengthM: 20,
          load: known(9000),
          loadType: 'cooker',
          device: { kind: 'mcb', curve: 'B', ratingA: null },
        },
      ),
    );
    expect(r.inA).toBe(40);
    expect(r.csaMm2).toBe(6);
    expect(r.zsOhm).toBeCloseTo(0.30176, 5);
    expect(r.cpcMinMm2).toBeCloseTo(2.0959, 3);
    expect(r.verdict).not.toBe('fails');
  });
});

describe('6. k for the cpc from Table 54.3 wherever it is bunched with the line conductors', () => {
  it('single-core cables in conduit take 115 (70 °C thermoplastic), not 143', () => {
    expect(kFactor('single-pvc-70', 4)).toBe(115);
    expect(kFactor('te-70', 1.5)).toBe(115);
    expect(kFactor('multi-pvc-70', 2.5)).toBe(115);
    expect(kFactor('swa-xlpe-90', 2.5)).toBe(143);
  });

  it('a 6 kW radial in 4 mm² singles: S = √(I²t) / 115', () => {
    // Ib = 6000/230 = 26.09 A → B32; Table 4D1A method B (2 loaded) 4 mm² 32 A (from memory).
    // Zs = 0.35 + (4.61 + 4.61) · 1.2 · 20 / 1000 = 0.57128 Ω; I = 230 / 0.57128 = 402.6 A ≥ 160 A.
    // I²·0.1 = 16,209 A²s, below the class 3 limit at 3 kA for B32 (18,000 A²s, from memory):
    //   S = √16,209 / 115 = 1.1071 mm² (with 143 it would have been 0.8903 mm²).
    const r = sizeCircuit(
      circuit(FLAT_SUPPLY, {
        phases: 1,
        use: 'fixed',
        load: known(6000),
        lengthM: 20,
        cable: 'single-pvc-70',
        method: 'B',
        ambientC: 30,
        csaMm2: null,
        device: { kind: 'mcb', curve: 'B', ratingA: null },
      }),
    );
    expect(r.csaMm2).toBe(4);
    expect(r.zsOhm).toBeCloseTo(0.57128, 5);
    expect(r.cpcMinMm2).toBeCloseTo(1.1071, 3);
    expect(checkOf(r, 'adiabatic').reference).toMatch(/Table 54\.3/);
  });
});

describe('7. armoured cable: spare core or the armour, with its own resistance and k (Table 54.4)', () => {
  const swa = (armouredCpc?: 'armour' | 'spare-core') =>
    sizeCircuit(
      circuit(FLAT_SUPPLY, {
        phases: 1,
        use: 'fixed',
        load: known(4000),
        lengthM: 30,
        cable: 'swa-xlpe-90',
        method: 'C',
        ambientC: 30,
        csaMm2: 2.5,
        ...(armouredCpc ? { armouredCpc } : {}),
        device: { kind: 'mcb', curve: 'B', ratingA: null },
      }),
    );

  it('single-phase defaults to a spare core of a 3-core cable (R2 = a 2.5 mm² core at 90 °C)', () => {
    // R1+R2 = (7.41 + 7.41) · 1.28 · 30 / 1000 = 0.56909 Ω; Zs = 0.91909 Ω.
    const r = swa();
    expect(r.cpcKind).toBe('spare-core');
    expect(r.cpcMm2).toBe(2.5);
    expect(r.zsOhm).toBeCloseTo(0.91909, 5);
  });

  it('the armour as cpc: its area and resistance, and k = 46', () => {
    // 2-core 2.5 mm² BS 5467: armour 17 mm² (maker's datasheet), 8.8 mΩ/m at 20 °C (from memory),
    //   × 1.27 at 80 °C = 11.176 mΩ/m. R1 = 7.41 · 1.28 = 9.4848 mΩ/m.
    // R1+R2 = (9.4848 + 11.176) · 30 / 1000 = 0.61982 Ω; Zs = 0.96982 Ω ≤ 2.185 Ω (B20).
    // I = 230 / 0.96982 = 237.16 A ≥ 100 A: I²·0.1 = 5,624 A²s; S = √5,624 / 46 = 1.6303 mm² ≤ 17 mm².
    const r = swa('armour');
    expect(r.inA).toBe(20);
    expect(r.cpcKind).toBe('armour');
    expect(r.cpcMm2).toBe(17);
    expect(r.r1r2Ohm).toBeCloseTo(0.61982, 5);
    expect(r.zsOhm).toBeCloseTo(0.96982, 5);
    expect(r.cpcMinMm2).toBeCloseTo(1.6303, 3);
    expect(checkOf(r, 'adiabatic').reference).toMatch(/Table 54\.4/);
  });

  it('only armoured cable accepts an armour choice', () => {
    expect(() =>
      sizeCircuit(
        raw(FLAT_SUPPLY, {
          ...te,
          use: 'fixed',
          method: 'C',
          lengthM: 5,
          load: known(100),
          armouredCpc: 'armour',
          device: { kind: 'mcb', curve: 'B', ratingA: null },
        }),
      ),
    ).toThrow(/armouredCpc/);
  });
});

describe('8. grouping for method D from Tables 4C2 (direct) and 4C3 (in ducts)', () => {
  const buried = (g: Loose, inDucts?: boolean) =>
    sizeCircuit(
      circuit(FLAT_SUPPLY, {
        phases: 1,
        use: 'fixed',
        load: known(3000),
        lengthM: 20,
        cable: 'swa-xlpe-90',
        method: 'D',
        ambientC: 20,
        csaMm2: null,
        grouping: g,
        ...(inDucts === undefined ? {} : { inDucts }),
        device: { kind: 'mcb', curve: 'B', ratingA: null },
      }),
    );

  it('3 circuits touching: direct 0.65, in ducts 0.75 (not 4C1 bunched 0.70) — from memory', () => {
    expect(buried({ circuits: 3, arrangement: 'bunched' }).factors.cg).toBe(0.65);
    expect(buried({ circuits: 3, arrangement: 'bunched' }, true).factors.cg).toBe(0.75);
  });

  it('spaced 0.5 m: 4 circuits direct 0.80 (confirmed)', () => {
    expect(buried({ circuits: 4, arrangement: 'bunched', spacingM: 0.5 }).factors.cg).toBe(0.8);
    // 0.3 m takes the 0.25 m column (the next smaller clearance): 0.75
    expect(buried({ circuits: 4, arrangement: 'bunched', spacingM: 0.3 }).factors.cg).toBe(0.75);
  });

  it('more than 6 circuits in the ground: no tabulated factor, a failed check says so', () => {
    const r = buried({ circuits: 8, arrangement: 'bunched' });
    expect(r.factors.cg).toBeNull();
    expect(checkOf(r, 'grouping').ok).toBe(false);
    expect(r.verdict).toBe('fails');
  });
});

describe('9. thermal insulation derates the method C rating (Table 52.2)', () => {
  it('3 kW through 1 m of insulation in method A: 4 mm², not 6 mm²', () => {
    // Ib = 13.04 A → B16. Ci (≥ 500 mm) 0.50 (confirmed). Run's It = min(It_A, It_C × 0.5), Table 4D5:
    //   2.5 mm²: min(20, 27 × 0.5 = 13.5) = 13.5 < 16; 4 mm²: min(26, 37 × 0.5 = 18.5) = 18.5 ≥ 16.
    const r = sizeCircuit(
      circuit(FLAT_SUPPLY, {
        ...te,
        use: 'fixed',
        method: 'A',
        lengthM: 10,
        insulationMm: 1000,
        load: known(3000),
        device: { kind: 'mcb', curve: 'B', ratingA: null },
      }),
    );
    expect(r.factors.ci).toBe(0.5);
    expect(r.csaMm2).toBe(4);
    expect(r.itA).toBeCloseTo(18.5, 9);
    expect(r.izA).toBeCloseTo(18.5, 9);
  });
});

describe('10. volt drop above 16 mm² uses the impedance z', () => {
  it('4E4B (confirmed): 25 mm² two-core z 1.90 mV/A/m; three-phase 1.65', () => {
    // 20 kW single-phase: Ib = 86.96 A → BS 88-2 100 A. VD = 1.90 · 86.957 · 30 / 1000 = 4.9565 V.
    const r = sizeCircuit(
      circuit(FLAT_SUPPLY, {
        phases: 1,
        use: 'distribution',
        load: known(20000),
        lengthM: 30,
        cable: 'swa-xlpe-90',
        method: 'C',
        ambientC: 30,
        csaMm2: 25,
        device: { kind: 'fuse-bs88-2', ratingA: null },
      }),
    );
    expect(r.tableRow?.mvAm).toBe(1.9);
    expect(r.vdV).toBeCloseTo(4.9565, 3);
  });

  it('single-core 120 mm² in conduit: z = √(0.38² + 0.27²) = 0.4662 mV/A/m, 14 % above r alone (from memory)', () => {
    // 40 kW at 230 V: Ib = 173.9 A → BS 88-2 200 A. VD = 0.46615 · 173.913 · 40 / 1000 = 3.2428 V.
    const r = sizeCircuit(
      circuit(FLAT_SUPPLY, {
        phases: 1,
        use: 'distribution',
        load: known(40000),
        lengthM: 40,
        cable: 'single-pvc-70',
        method: 'B',
        ambientC: 30,
        csaMm2: 120,
        device: { kind: 'fuse-bs88-2', ratingA: null },
      }),
    );
    expect(r.tableRow?.mvAm).toBeCloseTo(0.46615, 4);
    expect(r.vdV).toBeCloseTo(3.2428, 3);
  });
});

describe('11. diversity by the kind of load of each way, never from its text', () => {
  const way = (id: string, ratingA: number, watts: number, loadType: string, serves: string) => ({
    id,
    device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA },
    circuit: { ...te, use: 'fixed', method: 'C', lengthM: 10, serves, loadType, load: known(watts) },
  });
  const board = () =>
    boardInputSchema.parse({
      supply: FLAT_SUPPLY,
      phases: 1,
      enclosureModules: 12,
      dwelling: true,
      incoming: { kind: 'main-switch', ratingA: 100 },
      ways: [
        { id: 'rcd', device: { kind: 'rcd', poles: 2, modules: 2, rcdMa: 30, ratingA: 80 }, circuit: null },
        way('ev', 32, 7360, 'ev-charger', 'Drive'),
        way('sh1', 16, 3400, 'storage-heating', 'Hall'),
        way('sh2', 16, 3400, 'storage-heating', 'Lounge'),
        way('cook', 50, 10000, 'cooker', 'Kitchen'),
      ],
    });

  it('an EV charger and storage heaters take 100 %; the cooker 10 A + 30 %: 81.6 A', () => {
    // EV 7360/230 = 32 A × 100 % (BS 7671 722.311, from memory); storage heaters 2 × 14.783 = 29.565 A × 100 %;
    // cooker 10000/230 = 43.478 A → 10 + 0.3 × 33.478 = 20.043 A. Max demand = 32 + 29.565 + 20.043 = 81.608 A.
    // (Guessing from text gave the EV and heaters 10 A + 50 %: 35.8 + 20.0 = 55.8 A.)
    const out = sizeBoard(board());
    expect(out.summary.maxDemandA).toBeCloseTo(81.608, 2);
    const rules = out.summary.diversityRules.map((r) => r.rule).join(' | ');
    expect(rules).toMatch(/Electric vehicle chargers: 100 %/);
    expect(rules).toMatch(/storage space heating: 100 %/);
    for (const r of out.summary.diversityRules) expect(r.source.length).toBeGreaterThan(0);
  });

  it('the way text is never read: "Cooker" with no kind of load counts as other', () => {
    const spec = { ...te, use: 'fixed', method: 'C', lengthM: 10, serves: 'Cooker and hob', load: known(9000) };
    expect(diversityClass(spec as never)).toBe('other');
    expect(diversityClass({ ...spec, loadType: 'cooker' } as never)).toBe('cooker');
  });
});

describe('12. breaking capacity against the assembly rating the board declares', () => {
  const ways = [
    {
      id: 'w1',
      device: { kind: 'rcbo', poles: 1, modules: 1, curve: 'B', ratingA: 16, breakingKa: 6, rcdMa: 30 },
      circuit: { ...te, use: 'fixed', method: 'C', lengthM: 10, load: known(2000) },
    },
  ];
  const base = {
    supply: { ...FLAT_SUPPLY, zeOhm: 0.05, pfcKa: 10 },
    phases: 1,
    enclosureModules: 6,
    incoming: { kind: 'main-switch', ratingA: 100 },
    ways,
  };

  it('a 6 kA RCBO on a 10 kA supply fails on its own and passes in a 16 kA consumer unit (BS EN 61439-3)', () => {
    const alone = sizeBoard(boardInputSchema.parse(base)).ways[0].result!;
    expect(checkOf(alone, 'breaking-capacity').ok).toBe(false);
    const inUnit = sizeBoard(boardInputSchema.parse({ ...base, conditionalRatingKa: 16 })).ways[0].result!;
    const k = checkOf(inUnit, 'breaking-capacity');
    expect(k.ok).toBe(true);
    expect(k.message).toMatch(/16 kA/);
    expect(k.message).toMatch(/61439-3/);
  });

  it('a supply above the assembly rating still fails', () => {
    const over = sizeBoard(
      boardInputSchema.parse({ ...base, supply: { ...base.supply, pfcKa: 20 }, conditionalRatingKa: 16 }),
    ).ways[0].result!;
    expect(checkOf(over, 'breaking-capacity').ok).toBe(false);
  });
});

describe('13. special locations: a bath or shower room needs 30 mA RCD protection (701.411.3.3)', () => {
  const shower = (device: Loose, specialLocation?: string) =>
    sizeCircuit(
      circuit(FLAT_SUPPLY, {
        ...te,
        use: 'fixed',
        method: 'C',
        lengthM: 12,
        load: known(9200),
        loadType: 'shower',
        ...(specialLocation ? { specialLocation } : {}),
        device,
      }),
    );

  it('a 9.2 kW shower on a B40 with no RCD fails, and the check says why', () => {
    const r = shower({ kind: 'mcb', curve: 'B', ratingA: null }, 'bath-shower');
    const k = checkOf(r, 'rcd-additional');
    expect(k.ok).toBe(false);
    expect(k.message).toMatch(/bath or shower/);
    expect(k.reference).toMatch(/701\.411\.3\.3/);
    expect(r.verdict).toBe('fails');
  });

  it('the same shower on a 30 mA RCBO passes that check', () => {
    const r = shower({ kind: 'rcbo', curve: 'B', ratingA: null, rcdMa: 30 }, 'bath-shower');
    expect(checkOf(r, 'rcd-additional').ok).toBe(true);
  });

  it('outdoors, up to 32 A: 30 mA RCD (411.3.3)', () => {
    const r = sizeCircuit(
      circuit(FLAT_SUPPLY, {
        ...te,
        use: 'fixed',
        method: 'C',
        lengthM: 12,
        load: known(2000),
        specialLocation: 'outdoors',
        device: { kind: 'mcb', curve: 'B', ratingA: null },
      }),
    );
    expect(checkOf(r, 'rcd-additional').ok).toBe(false);
  });
});
