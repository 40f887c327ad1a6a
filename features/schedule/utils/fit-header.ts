/**
 * The schedule's header and footer texts fitted to their boxes before react-pdf lays them out:
 * the header has a fixed height (`PAGE.headerHeight`, which the pagination counts on), so a long
 * board name, place or "Fed from" would otherwise run over the facts beside or the rule below
 * it. The board name steps down in size until it fits; what still does not fit is shortened with
 * an ellipsis, keeping the part that matters most ("…, way 3L2" of a feed). Pure.
 */
import { cutWithEllipsis } from '@/lib/ellipsis';

import type { ScheduleData, ScheduleFact } from './build-schedule';
import type { TextMeasure } from './fonts';
import { countLines, PAGE } from './paginate-schedule';

/** The print font's line height as a share of its size (8.2 pt at 7 pt: ascent + descent). */
const LINE = PAGE.lineHeight / PAGE.fontSize;

/** Header geometry shared with the PDF document, points. */
export const HEADER = {
  /** Height of the header's content: its box less the padding above the rule. */
  contentHeight: PAGE.headerHeight - 4 - 6,
  brandWidth: 250,
  brandPadRight: 10,
  qrWidth: 58 + 6,
  factsPadX: 8,
  factLabelWidth: 50,
  factGap: 1,
  /** The board name's sizes, largest first: the first at which it fits is used. */
  nameSizes: [14, 12, 10, 8.5],
  orgSize: 7.5,
  titleSize: 8,
  titleGap: 3,
  nameGap: 1,
  placeSize: 8,
  placeGap: 2,
  /** The footer's page reference: its box's width and size. */
  footerWidth: 140,
  footerSize: 6.5,
} as const;

/** Width of a fact's value in either facts column, points. */
const FACT_VALUE_WIDTH =
  (PAGE.width - 2 * PAGE.marginX - HEADER.brandWidth - HEADER.qrWidth) / 2 -
  2 * HEADER.factsPadX -
  HEADER.factLabelWidth;
const BRAND_TEXT_WIDTH = HEADER.brandWidth - HEADER.brandPadRight;

export type FittedHeader = {
  boardName: string;
  boardNameSize: number;
  place: string;
  supply: ScheduleFact[];
  document: ScheduleFact[];
  /** The board's name as the footer's page reference prints it. */
  footerName: string;
};

type Box = { width: number; lines: number; size: number; bold?: boolean };

const fits = (text: string, box: Box, measure: TextMeasure) =>
  countLines(text, box.width, measure, box.size, box.bold) <= box.lines;

/**
 * `head` shortened (at a character, then back to a word's end when one is near) so that
 * `head… tail` fits the box; the whole text when it fits as it is.
 */
export function shortenToFit(head: string, tail: string, box: Box, measure: TextMeasure): string {
  if (fits(head + tail, box, measure)) return head + tail;
  let lo = 0;
  let hi = head.length;
  while (lo < hi) {
    const mid = Math.ceil((lo + hi) / 2);
    if (fits(`${head.slice(0, mid).trimEnd()}…${tail}`, box, measure)) lo = mid;
    else hi = mid - 1;
  }
  // Back to a word's end when one is in the last quarter of the cut
  return `${cutWithEllipsis(head, lo, lo * 0.75)}${tail}`;
}

/** A "Fed from" value keeps its way ("…, way 3L2"): the board's name is what gets shortened. */
function keptTail(fact: ScheduleFact): number {
  if (fact.label !== 'Fed from') return fact.value.length;
  const comma = fact.value.lastIndexOf(', ');
  return comma > 0 ? comma : fact.value.length;
}

/**
 * A facts column fitted to the header's height: every fact gets a line, and the lines left are
 * given to the facts that wrap, in order; a fact that wraps further is shortened to its share.
 */
export function fitFacts(facts: ScheduleFact[], measure: TextMeasure): ScheduleFact[] {
  const rows = Math.floor((HEADER.contentHeight + HEADER.factGap) / (PAGE.lineHeight + HEADER.factGap));
  const lines = (value: string) => countLines(value, FACT_VALUE_WIDTH, measure, PAGE.fontSize, true);
  const needed = facts.map((f) => lines(f.value));
  if (needed.reduce((a, b) => a + b, 0) <= rows) return facts;
  let spare = Math.max(0, rows - facts.length);
  return facts.map((f, i) => {
    const share = 1 + Math.min(spare, needed[i] - 1);
    spare -= share - 1;
    if (needed[i] <= share) return f;
    const at = keptTail(f);
    const box = { width: FACT_VALUE_WIDTH, lines: share, size: PAGE.fontSize, bold: true };
    return { ...f, value: shortenToFit(f.value.slice(0, at), f.value.slice(at), box, measure) };
  });
}

/** The header's and footer's texts of a schedule, fitted with the print font's measure. */
export function fitScheduleHeader(data: ScheduleData, measure: TextMeasure): FittedHeader {
  const placeText = `${data.siteName}${data.location ? ` · ${data.location}` : ''}`;
  const placeBox = { width: BRAND_TEXT_WIDTH, lines: 2, size: HEADER.placeSize };
  const place = shortenToFit(placeText, '', placeBox, measure);
  const placeLines = countLines(place, BRAND_TEXT_WIDTH, measure, HEADER.placeSize);
  const nameRoom =
    HEADER.contentHeight -
    LINE * (HEADER.orgSize + HEADER.titleSize + placeLines * HEADER.placeSize) -
    HEADER.titleGap -
    HEADER.nameGap -
    HEADER.placeGap;
  const nameBox = (size: number): Box => ({
    width: BRAND_TEXT_WIDTH,
    lines: Math.max(1, Math.floor(nameRoom / (LINE * size))),
    size,
    bold: true,
  });
  const size = HEADER.nameSizes.find((s) => fits(data.boardName, nameBox(s), measure)) ?? HEADER.nameSizes.at(-1)!;
  const boardName = shortenToFit(data.boardName, '', nameBox(size), measure);
  // The page reference says "· revision 12 · page 10 of 12" after the name: two lines in all
  const footerBox = { width: HEADER.footerWidth, lines: 2, size: HEADER.footerSize };
  const footerTail = ` · revision ${data.revision} · page 88 of 88`;
  const footerName = shortenToFit(data.boardName, footerTail, footerBox, measure).slice(0, -footerTail.length);
  return {
    boardName,
    boardNameSize: size,
    place,
    supply: fitFacts(data.supply, measure),
    document: fitFacts(data.document, measure),
    footerName,
  };
}
