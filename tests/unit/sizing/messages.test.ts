/**
 * Every message the engine writes is read by a person (the way panel, quick size, the review
 * page, the schedule): it names things in words through lib/names.ts and ways by their way
 * number, never by an internal code or an id, and it cites the wiring regulations one way.
 */
import crypto from 'node:crypto';

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

import {
  boardInputSchema,
  type BoardResult,
  CABLE_KINDS,
  circuitInputSchema,
  type CircuitResult,
  EARTHING_SYSTEMS,
  methodsFor,
  PROTECTIVE_DEVICE_KINDS,
  sizeBoard,
  sizeCircuit,
  SOCKET_ARRANGEMENT_KINDS,
  STANDARD_RATINGS_A,
} from '@/lib/sizing';
import { ARMOURED_CPC_KINDS, LOAD_TYPES, SPECIAL_LOCATIONS } from '@/lib/sizing/types';

/** Codes that must never reach a reader: every hyphenated or lower-case enum value the engine uses. */
const CODES = [
  ...PROTECTIVE_DEVICE_KINDS,
  'main-switch',
  ...SOCKET_ARRANGEMENT_KINDS,
  ...CABLE_KINDS,
  ...LOAD_TYPES.filter((t) => t.includes('-')),
  ...SPECIAL_LOCATIONS.filter((t) => t.includes('-')),
  ...ARMOURED_CPC_KINDS,
  'socket-arrangement',
  'single-layer',
  'near-limit',
];
const CODE_PATTERNS: RegExp[] = [
  ...CODES.map((c) => new RegExp(`(^|[^A-Za-z-])${c.replace(/[.*+?^${}()|[\]\\-]/g, '\\$&')}($|[^A-Za-z0-9-])`)),
  /\b(mcb|rcbo)[BCD]?\d*\b/, // "mcbB 32"
  /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/i, // a uuid
  /\bundefined\b|\bNaN\b|\bnull\b|\[object/,
];

function textsOfCircuit(r: CircuitResult): string[] {
  return [...r.checks.flatMap((k) => [k.message, k.reference]), ...r.notes];
}

function textsOfBoard(out: BoardResult): string[] {
  return [
    ...out.ways.flatMap((w) => (w.result ? textsOfCircuit(w.result) : [])),
    ...out.summary.checks.flatMap((k) => [k.message, k.reference]),
    ...out.summary.diversityRules.flatMap((r) => [r.rule, r.source]),
  ];
}

function expectReadable(texts: string[], seen: Set<string>): void {
  for (const t of texts) {
    seen.add(t.replace(/[0-9.]+/g, '#'));
    for (const p of CODE_PATTERNS) expect(t, `"${t}" matches ${p}`).not.toMatch(p);
    // One way of citing the regulations
    expect(t, t).not.toMatch(/BS ?7671(?!:2018\+A2:2022)/);
  }
}

const circuitArb = fc
  .record({
    earthing: fc.constantFrom(...EARTHING_SYSTEMS),
    zeOhm: fc.constantFrom(0, 0.05, 0.35, 0.8, 21, 200),
    pfcKa: fc.constantFrom(0, 1.5, 6, 16, 25),
    phases: fc.constantFrom(1, 3),
    use: fc.constantFrom('lighting', 'sockets', 'fixed', 'distribution'),
    socket: fc.boolean(),
    arrangement: fc.constantFrom(...SOCKET_ARRANGEMENT_KINDS),
    floorAreaM2: fc.constantFrom(10, 60, 120),
    watts: fc.constantFrom(50, 3000, 9500, 40000, 400000),
    lengthM: fc.constantFrom(1, 20, 120, 900),
    cable: fc.constantFrom(...CABLE_KINDS),
    methodIndex: fc.nat(),
    anyMethod: fc.constantFrom('A', 'B', 'C', 'D', 'E', '100', '103'),
    ambientC: fc.constantFrom(10, 30, 55, 85),
    circuits: fc.constantFrom(1, 4, 9, 25),
    insulationMm: fc.constantFrom(0, 100, 600),
    csaMm2: fc.constantFrom(null, 1, 2.5, 16, 300),
    deviceKind: fc.constantFrom(...PROTECTIVE_DEVICE_KINDS),
    curve: fc.constantFrom('B', 'C', 'D'),
    ratingIndex: fc.option(fc.nat(20), { nil: null }),
    rcdMa: fc.constantFrom(null, 30, 300),
    breakingKa: fc.constantFrom(undefined, 1, 6),
    conditionalRatingKa: fc.constantFrom(undefined, 16),
    loadType: fc.constantFrom(undefined, ...LOAD_TYPES),
    specialLocation: fc.constantFrom(undefined, ...SPECIAL_LOCATIONS),
    armouredCpc: fc.constantFrom(undefined, ...ARMOURED_CPC_KINDS),
    concealedInWall: fc.boolean(),
  })
  .map((g) => {
    const breaker = g.deviceKind === 'mcb' || g.deviceKind === 'rcbo';
    const list = STANDARD_RATINGS_A[g.deviceKind] as readonly number[];
    const methods = methodsFor(g.cable);
    const socket = g.socket && g.phases === 1;
    return {
      supply: { earthing: g.earthing, uoV: 230, zeOhm: g.zeOhm, pfcKa: g.pfcKa, source: 'public' },
      circuit: {
        phases: g.phases,
        use: socket ? 'sockets' : g.use,
        load: socket
          ? { kind: 'socket-arrangement', arrangement: g.arrangement, floorAreaM2: g.floorAreaM2 }
          : { kind: 'known', watts: g.watts, powerFactor: 0.9 },
        lengthM: g.lengthM,
        cable: g.cable,
        // Mostly a valid method, sometimes one the cable's table lacks
        method: g.methodIndex % 5 === 0 ? g.anyMethod : methods[g.methodIndex % methods.length],
        ambientC: g.ambientC,
        grouping: { circuits: g.circuits, arrangement: 'bunched' },
        insulationMm: g.insulationMm,
        csaMm2: g.csaMm2,
        concealedInWall: g.concealedInWall,
        ...(g.loadType ? { loadType: g.loadType } : {}),
        ...(g.specialLocation ? { specialLocation: g.specialLocation } : {}),
        ...(g.armouredCpc && g.cable === 'swa-xlpe-90' ? { armouredCpc: g.armouredCpc } : {}),
        device: {
          kind: g.deviceKind,
          ...(breaker ? { curve: g.curve } : {}),
          ratingA: g.ratingIndex === null ? null : list[g.ratingIndex % list.length],
          rcdMa: g.deviceKind === 'rcbo' ? (g.rcdMa ?? 30) : g.rcdMa,
          ...(g.breakingKa ? { breakingKa: g.breakingKa } : {}),
          ...(g.conditionalRatingKa ? { conditionalRatingKa: g.conditionalRatingKa } : {}),
        },
      },
    };
  });

describe('check messages name things in words', () => {
  it('the walk would catch the messages the engine used to write', () => {
    const old = [
      'Incoming main-switch 125 A ≥ maximum demand 40.0 A.',
      'Floor area served 60.0 m² ≤ 100 m² for a ring-32 arrangement.',
      'No standard fuse-bs88-2 rating carries Ib = 300.00 A.',
      'No tabulated max Zs for mcbB 32 A at 0.4 s.',
      'Way 0b3c2f9e-7d1a-4c55-9f1e-2a7b8c9d0e1f: no phase set; counted on L1.',
      'BS 7671:2018 433.1.1',
    ];
    for (const t of old) expect(() => expectReadable([t], new Set())).toThrow();
  });

  it(
    'no internal code, id or "undefined" in any message sizeCircuit writes, over varied circuits',
    { timeout: 60_000 },
    () => {
      const seen = new Set<string>();
      let sized = 0;
      fc.assert(
        fc.property(circuitArb, (input) => {
          const parsed = circuitInputSchema.safeParse(input);
          if (!parsed.success) return;
          sized += 1;
          expectReadable(textsOfCircuit(sizeCircuit(parsed.data)), seen);
        }),
        { numRuns: 700 },
      );
      expect(sized).toBeGreaterThan(300);
      // The walk reached many different messages, failing and passing
      expect(seen.size).toBeGreaterThan(60);
    },
  );

  it('board messages name ways by way number and devices by name, never by id or code', { timeout: 60_000 }, () => {
    const seen = new Set<string>();
    fc.assert(
      fc.property(
        fc.array(circuitArb, { minLength: 1, maxLength: 8 }),
        fc.constantFrom(1, 3),
        fc.constantFrom('main-switch', 'mcb', 'fuse-bs88-2', 'rcd'),
        fc.boolean(),
        (circuits, phases, incomingKind, dwelling) => {
          const ways = [
            { id: crypto.randomUUID(), device: { kind: 'main-switch', poles: 2, modules: 2 }, circuit: null },
            {
              id: crypto.randomUUID(),
              device: { kind: 'rcd', poles: 2, modules: 2, rcdMa: 30, ratingA: 63 },
              circuit: null,
            },
            ...circuits.map((c) => {
              const { device, ...spec } = c.circuit;
              // Three-phase circuits sometimes on a single-pole device (the poles check), no phase set
              return {
                id: crypto.randomUUID(),
                device: {
                  ...device,
                  poles: spec.phases === 3 && phases === 3 ? (device.kind === 'mcb' ? 1 : 3) : 1,
                  modules: 1,
                },
                circuit: phases === 1 ? { ...spec, phases: 1 } : spec,
              };
            }),
          ].map((w) => {
            if (w.circuit === null) return w;
            const { conditionalRatingKa: _c, ...device } = w.device as Record<string, unknown>;
            return { ...w, device };
          });
          const parsed = boardInputSchema.safeParse({
            supply: circuits[0].supply,
            phases,
            enclosureModules: 6,
            incoming: {
              kind: incomingKind,
              ratingA: 40,
              busbarRatingA: 32,
              ...(incomingKind === 'rcd' ? { rcdMa: 30 } : {}),
            },
            dwelling,
            conditionalRatingKa: 16,
            ways,
          });
          if (!parsed.success) return;
          expectReadable(textsOfBoard(sizeBoard(parsed.data)), seen);
        },
      ),
      { numRuns: 120 },
    );
    expect(seen.size).toBeGreaterThan(40);
  });

  it('a way is named by its number: "Way 2L1: a three-phase circuit needs a 3- or 4-pole device"', () => {
    const out = sizeBoard(
      boardInputSchema.parse({
        supply: { earthing: 'TN-C-S', uoV: 230, zeOhm: 0.35, pfcKa: 1.5, source: 'public' },
        phases: 3,
        enclosureModules: 12,
        incoming: { kind: 'fuse-bs88-2', ratingA: 63 },
        ways: [
          {
            id: crypto.randomUUID(),
            device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 6 },
            circuit: null,
          },
          {
            id: crypto.randomUUID(),
            device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 6 },
            circuit: null,
          },
          {
            id: crypto.randomUUID(),
            device: { kind: 'mcb', poles: 1, modules: 1, curve: 'B', ratingA: 6 },
            circuit: null,
          },
          {
            id: crypto.randomUUID(),
            device: { kind: 'mcb', poles: 1, modules: 1, curve: 'C', ratingA: 16 },
            circuit: {
              phases: 3,
              use: 'fixed',
              load: { kind: 'known', watts: 5000, powerFactor: 0.85 },
              lengthM: 10,
              cable: 'multi-pvc-70',
              method: 'C',
              ambientC: 30,
              csaMm2: null,
            },
          },
        ],
      }),
    );
    const poles = out.summary.checks.find((k) => k.code === 'poles')!;
    expect(poles.message).toBe('Way 2L1: a three-phase circuit needs a 3- or 4-pole device.');
    expect(out.summary.incomingCheck.message).toMatch(/^BS 88-2 fuse 63 A \(incoming\) ≥ maximum demand/);
  });
});
