import { describe, expect, it } from 'vitest';

import { sizeCircuit, SizingInputError, supplySchema } from '@/lib/sizing';

import { checkOf, circuit } from '../sizing/helpers';

// The engine's one option for a board fed by sub-mains: `supply.vdUsedPct`, the voltage drop
// the sub-mains above have already used. The limit runs from the origin (BS 7671:2018+A2:2022
// Appendix 4 Table 4Ab), so a final circuit on the board has the origin's limit less that.

const SUPPLY = { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' };

// A 3680 W immersion heater on a B16 MCB in 2.5 mm² twin and earth, clipped direct, 30 m.
// Ib = 3680 / 230 = 16 A. VD = 18 mV/A/m (Table 4D5, confirmed) · 16 A · 30 m / 1000 = 8.64 V
// = 8.64 / 230 = 3.7565 % of Uo.
const heater = (csaMm2: number | null) => ({
  phases: 1,
  use: 'fixed',
  load: { kind: 'known', watts: 3680, powerFactor: 1 },
  lengthM: 30,
  cable: 'te-70',
  method: 'C',
  ambientC: 30,
  csaMm2,
  device: { kind: 'mcb', curve: 'B', ratingA: 16, breakingKa: 6 },
});

describe('sizeCircuit with the voltage drop used above the board', () => {
  it('absent or 0: the origin limit (5 % for a circuit other than lighting), message as before', () => {
    const r = sizeCircuit(circuit(SUPPLY, heater(2.5)));
    expect(r.vdPct).toBeCloseTo(3.7565, 3);
    expect(r.vdLimitPct).toBe(5);
    const k = checkOf(r, 'voltage-drop');
    expect(k.ok).toBe(true);
    expect(k.message).toBe('Voltage drop 8.64 V = 3.76 % ≤ 5 %.');
    const zero = sizeCircuit(circuit({ ...SUPPLY, vdUsedPct: 0 }, heater(2.5)));
    expect(zero).toEqual(r);
  });

  it('1.5 % used above: the limit is 5 − 1.5 = 3.5 %, and 3.7565 % of a fixed 2.5 mm² fails, both parts named', () => {
    const r = sizeCircuit(circuit({ ...SUPPLY, vdUsedPct: 1.5 }, heater(2.5)));
    expect(r.vdLimitPct).toBeCloseTo(3.5, 12);
    const k = checkOf(r, 'voltage-drop');
    expect(k.ok).toBe(false);
    expect(k.message).toBe(
      'Voltage drop 8.64 V = 3.76 % > 3.50 % (5 % from the origin less 1.50 % used by the sub-mains above).',
    );
    expect(r.verdict).toBe('fails');
  });

  it('1.5 % used above and the size left to the engine: 4 mm² is chosen for the voltage drop', () => {
    // 4 mm²: 11 mV/A/m (Table 4D5, from memory) · 16 · 30 / 1000 = 5.28 V = 2.2957 % ≤ 3.5 %.
    const r = sizeCircuit(circuit({ ...SUPPLY, vdUsedPct: 1.5 }, heater(null)));
    expect(r.csaMm2).toBe(4);
    expect(r.vdPct).toBeCloseTo(2.2957, 3);
    expect(checkOf(r, 'voltage-drop').ok).toBe(true);
    // Without the sub-mains' share, 2.5 mm² would have done (3.7565 % ≤ 5 %).
    expect(sizeCircuit(circuit(SUPPLY, heater(null))).csaMm2).toBe(2.5);
  });

  it('lighting: 3 % less what is used above', () => {
    const r = sizeCircuit(
      circuit(
        { ...SUPPLY, vdUsedPct: 1 },
        {
          ...heater(null),
          use: 'lighting',
          load: { kind: 'known', watts: 230, powerFactor: 1 },
          device: { kind: 'mcb', curve: 'B', ratingA: 6 },
        },
      ),
    );
    expect(r.vdLimitPct).toBeCloseTo(2, 12);
  });

  it('refuses a negative share, naming the field', () => {
    expect(supplySchema.safeParse({ ...SUPPLY, vdUsedPct: -1 }).success).toBe(false);
    expect(() => sizeCircuit({ supply: { ...SUPPLY, vdUsedPct: -1 }, circuit: heater(2.5) } as never)).toThrow(
      SizingInputError,
    );
    try {
      sizeCircuit({ supply: { ...SUPPLY, vdUsedPct: -1 }, circuit: heater(2.5) } as never);
    } catch (e) {
      expect((e as SizingInputError).issues.map((i) => i.path)).toContain('supply.vdUsedPct');
    }
  });
});
