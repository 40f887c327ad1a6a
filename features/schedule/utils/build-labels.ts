/**
 * The label strips of a board: one label per device on the rail, as wide as the device, in
 * rail order. Each rail is one continuous strip; a rail longer than an A4 page is wide is
 * printed in pieces that meet at a marked join (J1, J2, …), between two devices, so that the
 * pieces are butted together into the one strip. Pure.
 */
import { layoutWays, railOrder } from '@/lib/boards/layout';
import { labelTextOf } from '@/lib/boards/revision-diff';
import { deviceName } from '@/lib/names';
import type { ScheduleSource } from '@/lib/dal/schedule-source';

import { shortenToFit } from './fit-header';
import type { TextMeasure } from './fonts';
import { countLines, PAGE } from './paginate-schedule';

/** The common DIN-rail module pitch, mm (one 1-pole MCB is 17.5 mm wide: common practice, EN 60715 rail). */
export const MODULE_PITCH_MM = 17.5;

/** Printable width across an A4 landscape page with 10 mm margins, mm. */
export const STRIP_WIDTH_MM = 297 - 2 * 10;

/** Width of a join mark at either end of a piece of a strip, mm (outside the labels: it is cut off). */
export const JOIN_MARK_MM = 6;

/** Modules that fit on one printed piece of a strip, with room for a join mark at each end. */
export const MODULES_PER_STRIP = Math.floor((STRIP_WIDTH_MM - 2 * JOIN_MARK_MM) / MODULE_PITCH_MM);

/** A label's geometry and type sizes, shared with the PDF document, points unless named. */
export const LABEL = {
  heightMm: 14,
  padX: 2,
  padY: 1.5,
  border: 0.6,
  refSize: 9,
  /** What the way serves: its sizes, largest first (the first at which it fits is used). */
  textSizes: [5.6, 5, 4.5],
  deviceSize: 4.8,
} as const;

/** Points per millimetre (72 pt to the inch). */
export const MM = 72 / 25.4;

export type LabelCell = {
  wayId: string;
  ref: string | null;
  text: string;
  /** The size the text is printed at, points (`fitLabelTexts`). */
  textSize: number;
  /** The whole text, when the label prints it shortened to fit (`fitLabelTexts`). */
  whole?: string;
  device: string;
  modules: number;
};

/**
 * One piece of a rail's strip. `joinBefore` names the join its left end meets (null at the
 * rail's first module), `joinAfter` the join its right end meets (null at the rail's end).
 */
export type LabelStrip = {
  firstModule: number;
  lastModule: number;
  cells: LabelCell[];
  joinBefore: string | null;
  joinAfter: string | null;
};

export type LabelSheet = {
  boardName: string;
  siteName: string;
  revision: number;
  draft: boolean;
  rails: { rail: number; modules: number; strips: LabelStrip[] }[];
  fileName: string;
};

/** The label strips of a board state, rail by rail. */
export function buildLabelSheet(source: ScheduleSource): LabelSheet {
  const { settings, ways } = source.snapshot;
  const ordered = railOrder(ways);
  const places = new Map(layoutWays(settings.phases, ordered).map((p) => [p.id, p]));
  const rails = [...new Set(ordered.map((w) => w.rail))].sort((a, b) => a - b);
  // Joins are numbered across the whole sheet, so that no two pieces of different rails match
  let joins = 0;
  const slug =
    settings.name
      .replace(/[^A-Za-z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .toLowerCase() || 'board';
  return {
    boardName: settings.name,
    siteName: source.snapshot.siteName,
    revision: source.revision,
    draft: !source.frozen,
    fileName: `labels-${slug}-rev${source.revision}${source.frozen ? '' : '-draft'}.pdf`,
    rails: rails.map((rail) => {
      const strips: LabelStrip[] = [];
      let current: LabelStrip | null = null;
      let moduleAt = 0;
      // The strip's cells in rail order; phase positions a three-pole way leaves empty before it
      // (layout.ts) are an empty cell of their width, so that every label lines up with its device
      const cells: LabelCell[] = ordered
        .filter((w) => w.rail === rail)
        .flatMap((way) => {
          const skipped = places.get(way.id)?.skippedBefore ?? 0;
          const gap: LabelCell[] = skipped
            ? [
                {
                  wayId: `${way.id}:gap`,
                  ref: null,
                  text: '',
                  textSize: LABEL.textSizes[0],
                  device: '',
                  modules: skipped,
                },
              ]
            : [];
          return [
            ...gap,
            {
              wayId: way.id,
              ref: places.get(way.id)?.label ?? null,
              text: labelTextOf(way),
              textSize: LABEL.textSizes[0],
              device: way.device.kind === 'blank' ? '' : deviceName(way.device),
              modules: Math.max(1, way.device.modules),
            },
          ];
        });
      for (const cell of cells) {
        const used: number = current ? current.lastModule - current.firstModule + 1 : 0;
        // A device never straddles two pieces: the strip is joined before it when it would not fit
        if (!current || used + cell.modules > MODULES_PER_STRIP) {
          const join: string | null = current ? `J${++joins}` : null;
          if (current) current.joinAfter = join;
          current = { firstModule: moduleAt + 1, lastModule: moduleAt, cells: [], joinBefore: join, joinAfter: null };
          strips.push(current);
        }
        current.cells.push(cell);
        moduleAt += cell.modules;
        current.lastModule = moduleAt;
      }
      return { rail, modules: moduleAt, strips };
    }),
  };
}

/**
 * The labels' texts fitted to their labels with the print font's measure: a long text steps
 * down in size (to 4.5 pt) to fit between the way's number and the device, and what still does
 * not fit ends in "…", rather than running over the device's name or out of the label (the
 * sheet lists such labels with their whole text, as the schedule has it).
 */
export function fitLabelTexts(sheet: LabelSheet, measure: TextMeasure): LabelSheet {
  const fit = (cell: LabelCell): LabelCell => {
    const { textSize, text } = fitLabelText(cell.text, cell.modules, measure);
    return { ...cell, textSize, text, ...(text === cell.text ? {} : { whole: cell.text }) };
  };
  return {
    ...sheet,
    rails: sheet.rails.map((rail) => ({
      ...rail,
      strips: rail.strips.map((strip) => ({ ...strip, cells: strip.cells.map(fit) })),
    })),
  };
}

/** A label's text fitted to a label `modules` wide (`fitLabelTexts`): the size it is printed at, and what is printed. */
export function fitLabelText(whole: string, modules: number, measure: TextMeasure): { textSize: number; text: string } {
  const line = PAGE.lineHeight / PAGE.fontSize;
  const room = LABEL.heightMm * MM - 2 * (LABEL.padY + LABEL.border) - line * (LABEL.refSize + LABEL.deviceSize);
  const width = modules * MODULE_PITCH_MM * MM - 2 * (LABEL.padX + LABEL.border);
  const box = (size: number) => ({ width, lines: Math.max(1, Math.floor(room / (line * size))), size });
  const fits = (size: number) => countLines(whole, width, measure, size) <= box(size).lines;
  const textSize = LABEL.textSizes.find(fits) ?? LABEL.textSizes.at(-1)!;
  return { textSize, text: shortenToFit(whole, '', box(textSize), measure) };
}

/** The labels printed shortened, with their whole text: "way 3" (or the device) and the text. */
export function shortenedLabels(sheet: LabelSheet): { name: string; whole: string }[] {
  return sheet.rails.flatMap((rail) =>
    rail.strips.flatMap((strip) =>
      strip.cells.flatMap((c) => (c.whole ? [{ name: c.ref ? `Way ${c.ref}` : c.device, whole: c.whole }] : [])),
    ),
  );
}
