import { describe, expect, it } from 'vitest';

import {
  buildLabelSheet,
  fitLabelTexts,
  JOIN_MARK_MM,
  LABEL,
  MM,
  MODULE_PITCH_MM,
  shortenedLabels,
} from '@/features/schedule/utils/build-labels';
import { printFontMeasure } from '@/features/schedule/utils/fonts';
import { countLines, PAGE } from '@/features/schedule/utils/paginate-schedule';
import type { SnapshotWay } from '@/lib/boards/revision-diff';
import type { ScheduleSource } from '@/lib/dal/schedule-source';
import { demoWays, FLAT_BOARD } from '@/scripts/demo-data';

const device = (modules: 1 | 2 | 3 | 4, kind: SnapshotWay['device']['kind'] = 'mcb'): SnapshotWay['device'] =>
  kind === 'mcb' ? { kind, poles: modules, modules, curve: 'B', ratingA: 16 } : { kind, poles: modules, modules };

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
  it('each printed piece holds as many modules as fit across A4 landscape with its two join marks', () => {
    // A rail far longer than a page: 40 one-module breakers
    const ways: SnapshotWay[] = Array.from({ length: 40 }, (_, i) => ({
      id: `m${i}`,
      rail: 0,
      position: i,
      device: device(1),
      circuit: null,
    }));
    const pieces = buildLabelSheet(source(ways)).rails[0].strips;
    const widths = pieces.map((p) => p.lastModule - p.firstModule + 1);
    expect(widths.reduce((a, b) => a + b, 0)).toBe(40);
    const full = widths[0];
    // Every piece but the last is full; the last holds what is left
    expect(widths.slice(0, -1).every((w) => w === full)).toBe(true);
    expect(widths.at(-1)).toBe(40 - full * (pieces.length - 1));
    // The page: A4 is 297 mm long (ISO 216), less the label sheet's 10 mm margin each side
    const printable = 297 - 2 * 10;
    const drawn = (modules: number) => modules * MODULE_PITCH_MM + 2 * JOIN_MARK_MM;
    expect(drawn(full)).toBeLessThanOrEqual(printable);
    expect(drawn(full + 1)).toBeGreaterThan(printable);
    // So the pitch the pieces were cut to lies between these bounds, and the common 17.5 mm
    // module width (DIN 43880 built-in devices; from memory, common practice) is inside them
    const pitchAtMost = (printable - 2 * JOIN_MARK_MM) / full;
    const pitchAbove = (printable - 2 * JOIN_MARK_MM) / (full + 1);
    expect(17.5).toBeLessThanOrEqual(pitchAtMost);
    expect(17.5).toBeGreaterThan(pitchAbove);
    // The PDF draws each label to MODULE_PITCH_MM a module: the pitch the pieces were cut to
    expect(MODULE_PITCH_MM).toBeGreaterThan(pitchAbove);
    expect(MODULE_PITCH_MM).toBeLessThanOrEqual(pitchAtMost);
  });

  it('keep rail order, give each label its device’s modules and split a rail only at a marked join, never inside a device', () => {
    const ways: SnapshotWay[] = [
      { id: 'main', rail: 0, position: 0, device: device(2, 'main-switch'), circuit: null },
      ...Array.from({ length: 14 }, (_, i) => ({
        id: `m${i}`,
        rail: 0,
        position: i + 1,
        device: device(1),
        circuit: null,
      })),
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
    // One strip in two pieces: the first ends and the second starts at the same marked join
    expect([first.joinBefore, first.joinAfter, second.joinBefore, second.joinAfter]).toEqual([null, 'J1', 'J1', null]);
    // A rail that fits is one piece, without joins
    expect(sheet.rails[1].strips).toHaveLength(1);
    expect(sheet.rails[1].strips[0]).toMatchObject({ joinBefore: null, joinAfter: null });
    expect(first.cells[0]).toMatchObject({ ref: null, text: 'Main switch' });
    expect(first.cells[1]).toMatchObject({ ref: '1', text: 'Spare' });
    expect(sheet.rails[1].strips[0].cells[0]).toMatchObject({ text: 'Spare', device: '' });
  });

  it('the demo flat’s rail is one strip: no way wraps onto a row of its own without a join', () => {
    const flat = demoWays(FLAT_BOARD);
    const sheet = buildLabelSheet(source(flat));
    expect(sheet.rails).toHaveLength(1);
    // The rail's length is the sum of its devices' widths, counted here from the demo's devices
    expect(sheet.rails[0].modules).toBe(flat.reduce((sum, w) => sum + w.device.modules, 0));
    const pieces = sheet.rails[0].strips;
    // Every piece but the last ends at a join that the next piece starts at
    pieces.forEach((piece, i) => {
      expect(piece.joinAfter).toBe(i < pieces.length - 1 ? `J${i + 1}` : null);
      expect(piece.joinBefore).toBe(i > 0 ? `J${i}` : null);
    });
    // The pieces together hold every device once, in rail order, and reach the rail's end
    expect(pieces.flatMap((p) => p.cells.map((c) => c.wayId))).toEqual(flat.map((w) => w.id));
    expect(pieces.at(-1)!.lastModule).toBe(sheet.rails[0].modules);
  });

  it('on a three-phase board, the phase positions left empty before a three-pole way are an empty label of their width', () => {
    const ways: SnapshotWay[] = [
      { id: 'main', rail: 0, position: 0, device: device(4, 'main-switch'), circuit: null },
      { id: 'one', rail: 0, position: 1, device: device(1), circuit: null },
      { id: 'three', rail: 0, position: 2, device: device(3), circuit: null },
    ];
    const sheet = buildLabelSheet(source(ways, 3));
    const cells = sheet.rails[0].strips.flatMap((p) => p.cells);
    expect(cells.map((c) => [c.ref, c.modules])).toEqual([
      [null, 4],
      ['1L1', 1],
      [null, 2],
      ['2L1–L3', 3],
    ]);
    expect(cells[2]).toMatchObject({ text: '', device: '' });
    // The strip is as long as the rail is drawn: 4 + 1 + 2 + 3 modules
    expect(sheet.rails[0].modules).toBe(10);
  });

  it('a long text steps down in size, then is cut with an ellipsis, to fit between the number and the device', async () => {
    const measure = await printFontMeasure();
    const serves = (text: string) => ({
      phases: 1 as const,
      cable: 'te-70' as const,
      method: 'C' as const,
      ambientC: 30,
      insulationMm: 0,
      csaMm2: null,
      serves: text,
      use: 'lighting' as const,
      load: { kind: 'known' as const, watts: 300, powerFactor: 1 },
      lengthM: 10,
    });
    const texts = [
      'Lights',
      'Sockets: office and mess room (radial) and kitchen',
      'Lighting: machine shop north bay, office corridor, stair and the store room beside the yard door',
    ];
    const ways = texts.map((t, i) => ({ id: `w${i}`, rail: 0, position: i, device: device(1), circuit: serves(t) }));
    const cells = fitLabelTexts(buildLabelSheet(source(ways as SnapshotWay[])), measure).rails[0].strips[0].cells;
    // A short text at the full size, whole
    expect(cells[0]).toMatchObject({ text: 'Lights', textSize: 5.6 });
    // Each text in the room its label has (14 mm less the padding, the number and the device), so
    // that it never runs over the device's name
    const line = PAGE.lineHeight / PAGE.fontSize;
    const room = LABEL.heightMm * MM - 2 * (LABEL.padY + LABEL.border) - line * (LABEL.refSize + LABEL.deviceSize);
    const width = MODULE_PITCH_MM * MM - 2 * (LABEL.padX + LABEL.border);
    for (const c of cells)
      expect(countLines(c.text, width, measure, c.textSize) * line * c.textSize).toBeLessThanOrEqual(room);
    // A longer one smaller but whole; the longest at the smallest size, cut
    expect(cells[1].textSize).toBeLessThan(5.6);
    expect(cells[1].text).toBe(texts[1]);
    expect(cells[2].textSize).toBe(4.5);
    expect(cells[2].text).toMatch(/^Lighting: machine shop .*…$/);
    // The sheet lists the shortened label with its whole text; the others are not listed
    expect(shortenedLabels(fitLabelTexts(buildLabelSheet(source(ways as SnapshotWay[])), measure))).toEqual([
      { name: 'Way 3', whole: texts[2] },
    ]);
    expect(cells[1].whole).toBeUndefined();
  });
});
