import { describe, expect, it } from 'vitest';

import { buildSchedule, SCHEDULE_COLUMNS } from '@/features/schedule/utils/build-schedule';
import type { SnapshotWay } from '@/lib/boards/revision-diff';
import { boardSizingInput } from '@/lib/boards/sizing-input';
import type { ScheduleSource } from '@/lib/dal/review';
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
      ['RCD 40 A, 30 mA, type A', ['2', '3']],
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
    expect(walked.groups[0].rows[0].cells.label).toBe('✗ Missing: No label at all');
  });

  it('a draft says it is not issued, in its status and in a notice', () => {
    const data = buildSchedule(source([{ id: 'x', device: mcb, circuit: circuit('Lights') }], { frozen: false, issued: null, status: 'draft' }));
    expect(data.draft).toBe(true);
    expect(data.document).toContainEqual({ label: 'Issued', value: 'Not issued' });
    expect(data.notices.map((n) => n.title)).toContain('Not issued');
    expect(data.fileName).toBe('schedule-garage-board-rev4-draft.pdf');
  });
});
