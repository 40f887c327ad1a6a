/**
 * Splits a schedule into A4 landscape pages before react-pdf lays it out. Laying out
 * pages ourselves, from conservative height estimates, is several times faster than
 * letting react-pdf split a long table, and lets every page repeat the header, the
 * column headings and the group it continues. Pure.
 */
import type { ScheduleColumn, ScheduleRow } from '../types/schedule-table';
import type { ScheduleData } from './build-schedule';
import type { TextMeasure } from './fonts';

/** Page geometry shared with the PDF document, points (A4 landscape is 841.89 × 595.28). */
export const PAGE = {
  width: 841.89,
  height: 595.28,
  marginX: 24,
  marginTop: 22,
  marginBottom: 46,
  headerHeight: 84,
  draftBannerHeight: 16,
  /** The line saying the values are the design's, not readings, under the header of every page. */
  designValuesHeight: 12,
  headRowHeight: 24,
  groupHeight: 16,
  fontSize: 7,
  /** The print font's own line height at 7 pt (ascent + descent), points. */
  lineHeight: 8.2,
  cellPadY: 4.4,
  cellPadX: 5,
  noteLineHeight: 9,
} as const;

/** Width of the table, points. */
export const TABLE_WIDTH = PAGE.width - 2 * PAGE.marginX;

/**
 * A group's heading as a page prints it: marked continued when the page starts inside the group,
 * once (a run of ways that resumes after an RCBO is headed "… (continued)" already).
 */
export function pageGroupHeading(item: { heading: string; continued: boolean }): string {
  return item.continued && !item.heading.endsWith('(continued)') ? `${item.heading} (continued)` : item.heading;
}

/** Room for the body of a page below the header, points. */
const BODY_HEIGHT = PAGE.height - PAGE.marginTop - PAGE.marginBottom - PAGE.headerHeight;

/** A stand-in measure when the font is not at hand: every character as wide as a digit and a bit. */
export const roughMeasure: TextMeasure = (text, fontSize) => text.length * fontSize * 0.6;

export type PageItem =
  { kind: 'group'; heading: string; continued: boolean } | { kind: 'row'; row: ScheduleRow; index: number };

export type SchedulePage = {
  items: PageItem[];
  /** Whether this page carries the totals and notices. */
  summary: boolean;
  /** Design notes printed on this page. */
  notes: string[];
};

/** Columns scaled to fill the table width. */
export function scaledColumns(columns: readonly ScheduleColumn[]): (ScheduleColumn & { pt: number })[] {
  const scale = TABLE_WIDTH / columns.reduce((sum, c) => sum + c.width, 0);
  return columns.map((c) => ({ ...c, pt: c.width * scale }));
}

/**
 * Lines a text takes in a box `widthPt` wide, wrapping at spaces as a line breaker does
 * (a word longer than the line is split). One point of slack per line is kept on purpose.
 */
export function countLines(
  text: string,
  widthPt: number,
  measure: TextMeasure,
  fontSize: number = PAGE.fontSize,
  bold = false,
): number {
  const room = widthPt - 1;
  const space = measure(' ', fontSize, bold);
  let lines = 1;
  let used = 0;
  for (const word of text.split(/\s+/).filter(Boolean)) {
    let w = measure(word, fontSize, bold);
    const gap = used > 0 ? space : 0;
    if (used + gap + w <= room) {
      used += gap + w;
      continue;
    }
    if (used > 0) lines += 1;
    // A word wider than a whole line runs over several
    while (w > room) {
      lines += 1;
      w -= room;
    }
    used = w;
  }
  return lines;
}

/** Height of one table row, points. */
export function rowHeight(
  row: ScheduleRow,
  columns: (ScheduleColumn & { pt: number })[],
  measure: TextMeasure,
): number {
  const lines = Math.max(
    ...columns.map((c) =>
      countLines(
        row.cells[c.key],
        c.pt - PAGE.cellPadX,
        measure,
        c.key === 'way' ? 7.5 : PAGE.fontSize,
        c.key === 'way' || c.key === 'result',
      ),
    ),
  );
  return lines * PAGE.lineHeight + PAGE.cellPadY;
}

/** Height of the totals-and-notices block, points. */
export function summaryHeight(data: ScheduleData, measure: TextMeasure): number {
  const title = 14;
  const totals = title + data.totals.reduce((h, t) => h + countLines(t.value, 170, measure, 7, true) * 9, 0);
  const notices =
    title +
    data.notices.reduce((h, n) => h + 9 + countLines(n.text, TABLE_WIDTH - 310, measure) * 9 + 4, 0) +
    countLines(data.noticesNote, TABLE_WIDTH - 310, measure, 6.5) * 9;
  return Math.max(totals, notices) + 10;
}

/** The schedule's pages: rows in order, group headings repeated, then totals, notices and notes. */
export function paginateSchedule(data: ScheduleData, measure: TextMeasure = roughMeasure): SchedulePage[] {
  const columns = scaledColumns(data.columns);
  const top = (data.draft ? PAGE.draftBannerHeight : 0) + PAGE.designValuesHeight + PAGE.headRowHeight;
  const pages: SchedulePage[] = [];
  let page: SchedulePage = { items: [], summary: false, notes: [] };
  let used = top;
  const newPage = () => {
    pages.push(page);
    page = { items: [], summary: false, notes: [] };
    used = top;
  };

  // Table rows; a group heading never ends a page, and a new page restates the group
  let index = 0;
  for (const group of data.groups) {
    group.rows.forEach((row, i) => {
      const h = rowHeight(row, columns, measure);
      const heading = i === 0 || page.items.length === 0;
      if (used + (heading ? PAGE.groupHeight : 0) + h > BODY_HEIGHT && page.items.length) newPage();
      if (i === 0 || page.items.length === 0) {
        page.items.push({ kind: 'group', heading: group.heading, continued: i > 0 });
        used += PAGE.groupHeight;
      }
      page.items.push({ kind: 'row', row, index: index++ });
      used += h;
    });
  }

  // Totals and notices together, on a new page if they do not fit
  const summary = summaryHeight(data, measure);
  if (used + summary > BODY_HEIGHT && page.items.length) newPage();
  page.summary = true;
  used += summary;

  // Design notes, line by line, running on as far as they need
  if (data.designNotes.length) used += 16;
  for (const note of data.designNotes) {
    const h = countLines(note, TABLE_WIDTH, measure, 6.5) * PAGE.noteLineHeight;
    if (used + h > BODY_HEIGHT) {
      newPage();
      used += 16;
    }
    page.notes.push(note);
    used += h;
  }
  pages.push(page);
  return pages;
}
