import { describe, expect, it } from 'vitest';

import { buildSchedule, SCHEDULE_COLUMNS } from '@/features/schedule/utils/build-schedule';
import type { SnapshotWay } from '@/lib/boards/revision-diff';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { boardInputSchema, SIZING_CAUTION, sizeBoard } from '@/lib/sizing';

const circuit = (serves: string): NonNullable<SnapshotWay['circuit']> => ({
  serves,
  phases: 1,
  use: 'lighting',
  load: { kind: 'known', watts: 500, powerFactor: 1 },
  lengthM: 20,
  cable: 'te-70',
  method: 'C',
  ambientC: 30,
  grouping: { circuits: 1, arrangement: 'bunched' },
  insulationMm: 0,
  csaMm2: null,
  concealedInWall: false,
});

function source(ways: Omit<SnapshotWay, 'rail' | 'position'>[], extra: Partial<ScheduleSource> = {}): ScheduleSource {
  const placed = ways.map((w, position) => ({ ...w, rail: 0, position }));
  const settings: ScheduleSource['snapshot']['settings'] = {
    name: 'Garage board',
    location: 'Garage',
    phases: 1,
    supply: { earthing: 'TT', uoV: 230, zeOhm: 21, pfcKa: 1, source: 'public' },
    incoming: { kind: 'main-switch', ratingA: 63 },
    enclosureModules: 12,
    rails: 1,
    dwelling: false,
  };
  return {
    boardId: 'b',
    boardUrl: 'http://x/boards/b',
    snapshot: { settings, siteName: 'Site', organisationName: 'Org', ways: placed },
    sizing: sizeBoard(boardInputSchema.parse(boardSizingInput(settings, placed))),
    sizingIssues: [],
    revision: 4,
    status: 'issued',
    frozen: true,
    issued: { at: '2026-03-02T10:00:00Z', byName: 'Ada Inspector' },
    labels: null,
    updatedAt: '',
    ...extra,
  };
}

const mcb = { kind: 'mcb' as const, poles: 1 as const, modules: 1, curve: 'B' as const, ratingA: 6, breakingKa: 6 };

describe('the schedule’s content', () => {
  it('groups ways under the RCD before them, and a TT board with an RCD carries its notices', () => {
    const data = buildSchedule(
      source([
        { id: 'm', device: { kind: 'main-switch', poles: 2, modules: 2, ratingA: 63 }, circuit: null },
        { id: 'x', device: mcb, circuit: circuit('Outside light') },
        { id: 'r', device: { kind: 'rcd', poles: 2, modules: 2, ratingA: 40, rcdMa: 30, rcdType: 'A' }, circuit: null },
        { id: 'y', device: mcb, circuit: circuit('Garage lights') },
        { id: 's', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null },
      ]),
    );
    expect(data.groups.map((g) => [g.heading.split(':')[0], g.rows.map((r) => r.cells.way)])).toEqual([
      ['Main switch 63 A, 2-pole', ['1']],
      ['RCD 40 A 30 mA, type A', ['2', '3']],
    ]);
    expect(data.groups[1].rows[1]).toMatchObject({ spare: true, cells: { serves: 'Spare (blank)' } });
    expect(data.notices.map((n) => n.title)).toEqual(['Test the RCDs', 'Periodic inspection', 'TT earthing']);
    expect(data.caution).toBe(SIZING_CAUTION);
    expect(data.document).toContainEqual({ label: 'Issued', value: '2 Mar 2026 by Ada Inspector' });
  });

  it('has no RCD test notice without an RCD, and adds the label column only once a walk has results', () => {
    const ways = [{ id: 'x', device: mcb, circuit: circuit('Lights') }];
    const plain = buildSchedule(source(ways));
    expect(plain.notices.map((n) => n.title)).not.toContain('Test the RCDs');
    expect(plain.columns.map((c) => c.key)).not.toContain('label');
    const walked = buildSchedule(source(ways, { labels: { x: { status: 'missing', note: 'No label at all' } } }));
    expect(walked.columns.map((c) => c.heading)).toEqual(SCHEDULE_COLUMNS.map((c) => c.heading));
    expect(walked.groups[0].rows[0].cells.label).toBe('✗ Label is missing: No label at all');
  });

  it('a board fed from another board prints the carried Zdb and PFC, marked carried, and what feeds it', () => {
    const plain = source([{ id: 'x', device: mcb, circuit: circuit('Lights') }]);
    // As lib/dal/board-snapshot.ts freezes it: the supply the tree carried down (Zdb as its Ze)
    const carried = {
      earthing: 'TN-C-S' as const,
      uoV: 230,
      zeOhm: 0.443696,
      pfcKa: 0.9876,
      source: 'public' as const,
    };
    const fed = buildSchedule({
      ...plain,
      snapshot: {
        ...plain.snapshot,
        settings: { ...plain.snapshot.settings, supply: carried },
        fedFrom: 'Workshop DB1, way 1',
      },
    });
    expect(fed.supply).toContainEqual({ label: 'Fed from', value: 'Workshop DB1, way 1' });
    expect(fed.supply).toContainEqual({ label: 'Zdb (carried)', value: '0.444 Ω' });
    expect(fed.supply).toContainEqual({ label: 'PFC (carried)', value: '0.99 kA' });
    expect(fed.supply.map((r) => r.label)).not.toContain('Ze');
    // Nothing used above it (a board fed from a way with no volt drop carried): no such row
    expect(fed.supply.map((r) => r.label)).not.toContain('Vd used above');
    const used = buildSchedule({
      ...plain,
      snapshot: {
        ...plain.snapshot,
        settings: { ...plain.snapshot.settings, supply: { ...carried, vdUsedPct: 0.80302 } },
        fedFrom: 'Workshop DB1, way 1',
      },
    });
    expect(used.supply).toContainEqual({ label: 'Vd used above', value: '0.80 %' });
    // A board fed from the origin (or issued before) keeps its Ze and PFC as typed
    expect(buildSchedule(plain).supply).toContainEqual({ label: 'Ze', value: '21 Ω' });
  });

  it('prints the volt drop limit carried down to two decimals, and an origin limit whole', () => {
    const way = { id: 'x', device: mcb, circuit: circuit('Lights') };
    // A public supply's lighting limit is 3 % at the origin (BS 7671 Appendix 4, Table 4Ab); a
    // board whose sub-mains used 0.803 % leaves 3 − 0.803 = 2.197 % to its final circuits
    const fed = source([way]);
    const supply = { ...fed.snapshot.settings.supply, vdUsedPct: 0.803 };
    const settings = { ...fed.snapshot.settings, supply };
    const sizing = sizeBoard(boardInputSchema.parse(boardSizingInput(settings, fed.snapshot.ways)));
    expect(sizing.ways[0].result?.vdLimitPct).toBeCloseTo(2.197, 12);
    const vdCell = (s: ScheduleSource) => buildSchedule(s).groups.flatMap((g) => g.rows)[0].cells.vd;
    expect(vdCell({ ...fed, snapshot: { ...fed.snapshot, settings }, sizing })).toMatch(/^\d+\.\d\d \(2\.20\)$/);
    expect(vdCell(source([way]))).toMatch(/^\d+\.\d\d \(3\)$/);
  });

  it('a draft says it is not issued, in its status and in a notice', () => {
    const data = buildSchedule(
      source([{ id: 'x', device: mcb, circuit: circuit('Lights') }], { frozen: false, issued: null, status: 'draft' }),
    );
    expect(data.draft).toBe(true);
    expect(data.document).toContainEqual({ label: 'Issued', value: 'Not issued' });
    expect(data.notices.map((n) => n.title)).toContain('Not issued');
    expect(data.fileName).toBe('schedule-garage-board-rev4-draft.pdf');
  });

  it('one rule for RCD protection: a spare way after an RCD’s ways is under it, an RCBO after them protects itself, an MCB after the RCBO is the RCD’s again', () => {
    const rcbo = { ...mcb, kind: 'rcbo' as const, rcdMa: 30, rcdType: 'A' as const };
    const src = source([
      { id: 'm', device: { kind: 'main-switch', poles: 2, modules: 2, ratingA: 63 }, circuit: null },
      { id: 'r', device: { kind: 'rcd', poles: 2, modules: 2, ratingA: 40, rcdMa: 30, rcdType: 'A' }, circuit: null },
      { id: 'a', device: mcb, circuit: circuit('Lights') },
      { id: 's', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null },
      { id: 'o', device: rcbo, circuit: circuit('Shower') },
      { id: 'b', device: mcb, circuit: circuit('Loft lights') },
    ]);
    const data = buildSchedule(src);
    expect(data.groups.map((g) => [g.heading, g.rows.map((r) => r.cells.way)])).toEqual([
      ['RCD 40 A 30 mA, type A: RCD protection for the ways below', ['1', '2']],
      ['RCBOs: each way below has its own RCD protection', ['3']],
      ['RCD 40 A 30 mA, type A (continued)', ['4']],
    ]);
    // The engine says the same of every way
    const by = new Map(
      data.groups.flatMap((g) => g.rows.map((r) => [r.wayId, g.heading.startsWith('RCD') ? 'r' : r.wayId])),
    );
    const engine = src.sizing!.ways.filter((w) => by.has(w.id));
    expect(engine).toHaveLength(4);
    for (const w of engine) expect(by.get(w.id)).toBe(w.protectedBy);
  });

  it('counts ways by way number, not devices: the main switch and the RCD are not ways', () => {
    const data = buildSchedule(
      source([
        { id: 'm', device: { kind: 'main-switch', poles: 2, modules: 2, ratingA: 63 }, circuit: null },
        { id: 'r', device: { kind: 'rcd', poles: 2, modules: 2, ratingA: 40, rcdMa: 30, rcdType: 'A' }, circuit: null },
        { id: 'a', device: mcb, circuit: circuit('Lights') },
        { id: 's', device: { kind: 'blank', poles: 1, modules: 1 }, circuit: null },
      ]),
    );
    expect(data.totals[0]).toEqual({ label: 'Ways', value: '2 ways: 1 circuit, 1 spare' });
  });

  it('marks R1+R2 and Zs as design values, names cables with their temperature, and says the notices do not replace those BS 7671 requires', () => {
    const data = buildSchedule(source([{ id: 'x', device: mcb, circuit: circuit('Lights') }]));
    const heading = (key: string) => data.columns.find((c) => c.key === key)!.heading;
    expect(heading('r1r2')).toMatch(/^Design R1\+R2/);
    expect(heading('zs')).toMatch(/^Design Zs/);
    expect(data.designValuesNote).toMatch(/calculated from this design.*not measured.*not test results/);
    expect(data.noticesNote).toMatch(/do not replace the notices and labels BS 7671 requires at the board/);
    expect(data.groups[0].rows[0].cells.cable).toBe('Flat twin and earth 70 °C, method C');
    expect(data.supply).toContainEqual({ label: 'Incoming', value: 'Main switch 63 A' });
    expect(data.totals).toContainEqual({
      label: 'Incoming device',
      value: expect.stringMatching(/^Main switch 63 A, not less than the maximum demand of \d/),
    });
  });

  it('names a way by its number in a design note, never by its id', () => {
    const id = '3f2c8a4e-1b7d-4c55-9e0a-6d1f2b3c4d5e';
    const threePhaseOnOnePole = { ...circuit('Saw'), phases: 3 as const };
    const src = source([{ id, device: mcb, circuit: circuit('Lights') }]);
    const settings = { ...src.snapshot.settings, phases: 3 as const };
    const ways = [{ id, rail: 0, position: 0, device: mcb, circuit: threePhaseOnOnePole }];
    const sizing = sizeBoard(boardInputSchema.parse(boardSizingInput(settings, ways)));
    const data = buildSchedule({ ...src, snapshot: { ...src.snapshot, settings, ways }, sizing });
    expect(data.designNotes.length).toBeGreaterThan(0);
    expect(data.designNotes.join('\n')).not.toContain(id);
    expect(data.designNotes.some((n) => /\b[Ww]ay 1L1\b/.test(n))).toBe(true);
  });
});
