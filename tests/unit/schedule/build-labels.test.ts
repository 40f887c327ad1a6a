import { describe, expect, it } from 'vitest';

import { buildLabelSheet, MODULE_PITCH_MM, MODULES_PER_STRIP } from '@/features/schedule/utils/build-labels';
import type { SnapshotWay } from '@/lib/boards/revision-diff';
import type { ScheduleSource } from '@/lib/dal/review';

const device = (modules: 1 | 2 | 3 | 4, kind: SnapshotWay['device']['kind'] = 'mcb'): SnapshotWay['device'] =>
  kind === 'mcb'
    ? { kind, poles: modules, modules, curve: 'B', ratingA: 16 }
    : { kind, poles: modules, modules };

function source(ways: SnapshotWay[], phases: 1 | 3 = 1): ScheduleSource {
  return {
    boardId: 'b',
    boardUrl: 'http://x',
    snapshot: {
      settings: {
        name: 'Board',
        location: '',
        phases,
        supply: { earthing: 'TN-S', uoV: 230, zeOhm: 0.8, pfcKa: 3, source: 'public' },
        incoming: { kind: 'main-switch', ratingA: 100 },
        enclosureModules: 60,
        rails: 2,
        dwelling: false,
      },
      siteName: 'Site',
      organisationName: 'Org',
      ways,
    },
    sizing: null,
    sizingIssues: [],
    revision: 2,
    status: 'issued',
    frozen: true,
    issued: null,
    labels: null,
    updatedAt: '',
  };
}

describe('label strips', () => {
  it('fit 15 modules of 17.5 mm across A4 landscape with 12 mm margins (273 mm / 17.5 mm = 15.6)', () => {
    expect(MODULE_PITCH_MM).toBe(17.5);
    expect(MODULES_PER_STRIP).toBe(15);
  });

  it('keep rail order, give each label its device’s modules and never split a device across strips', () => {
    const ways: SnapshotWay[] = [
      { id: 'main', rail: 0, position: 0, device: device(2, 'main-switch'), circuit: null },
      ...Array.from({ length: 14 }, (_, i) => ({ id: `m${i}`, rail: 0, position: i + 1, device: device(1), circuit: null })),
      { id: 'last', rail: 0, position: 20, device: device(3), circuit: null },
      { id: 'r2', rail: 1, position: 0, device: device(1, 'blank'), circuit: null },
    ];
    const sheet = buildLabelSheet(source([...ways].reverse()));
    expect(sheet.rails.map((r) => r.rail)).toEqual([0, 1]);
    const [first, second] = sheet.rails[0].strips;
    // 2 + 13 = 15 modules; the fourteenth 1-module way starts the next strip with the 3-module device
    expect(first.cells.map((c) => c.wayId)).toEqual(['main', ...Array.from({ length: 13 }, (_, i) => `m${i}`)]);
    expect(first.cells.reduce((m, c) => m + c.modules, 0)).toBe(15);
    expect(second.cells.map((c) => [c.wayId, c.modules])).toEqual([
      ['m13', 1],
      ['last', 3],
    ]);
    expect([first.firstModule, first.lastModule, second.firstModule, second.lastModule]).toEqual([1, 15, 16, 19]);
    expect(first.cells[0]).toMatchObject({ ref: null, text: 'Main switch' });
    expect(first.cells[1]).toMatchObject({ ref: '1', text: 'Spare' });
    expect(sheet.rails[1].strips[0].cells[0]).toMatchObject({ text: 'Spare', device: '' });
  });
});
