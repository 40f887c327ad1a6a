import { describe, expect, it } from 'vitest';

import type { ScheduleData } from '@/features/schedule/utils/build-schedule';
import { fitFacts, fitScheduleHeader, HEADER, shortenToFit } from '@/features/schedule/utils/fit-header';
import { printFontMeasure } from '@/features/schedule/utils/fonts';
import { countLines, PAGE } from '@/features/schedule/utils/paginate-schedule';

/** Every character 4 pt wide at 7 pt, in proportion at other sizes: easy to reason about. */
const mono = (text: string, size: number) => (text.length * 4 * size) / 7;

const LONG_NAME =
  'Main distribution board in the east plant room, ground floor, serving the machine shop and offices — second section';

function data(extra: Partial<ScheduleData> = {}): ScheduleData {
  return {
    organisationName: 'Org',
    boardName: 'DB2',
    siteName: 'Site',
    location: 'Plant room',
    boardUrl: 'http://x',
    revision: 3,
    draft: false,
    statusWord: 'Issued',
    supply: [
      { label: 'Earthing', value: 'TN-C-S (PME)' },
      { label: 'Uo', value: '230 V' },
      { label: 'Fed from', value: 'Workshop DB1, way 3L2' },
      { label: 'Zdb (carried)', value: '0.350 Ω' },
      { label: 'PFC (carried)', value: '6.00 kA' },
      { label: 'Vd used above', value: '1.20 %' },
      { label: 'Phases', value: 'Single-phase, public supply' },
      { label: 'Incoming', value: 'Main switch 100 A' },
    ],
    document: [
      { label: 'Revision', value: '3' },
      { label: 'Status', value: 'Issued' },
      { label: 'Issued', value: '2 Mar 2026 by Ada Inspector' },
    ],
    columns: [],
    groups: [],
    totals: [],
    notices: [],
    noticesNote: '',
    notes: [],
    caution: '',
    designValuesNote: '',
    fileName: 'x.pdf',
    ...extra,
  } as ScheduleData;
}

/** Width of a fact's value (the header's geometry: two facts columns between the brand and the code). */
const VALUE_WIDTH =
  (PAGE.width - 2 * PAGE.marginX - HEADER.brandWidth - HEADER.qrWidth) / 2 -
  2 * HEADER.factsPadX -
  HEADER.factLabelWidth;

describe('the schedule header fitted to its fixed height (features/schedule/utils/fit-header.ts)', () => {
  it('leaves a short header exactly as it is, the name at its full 14 pt', () => {
    const d = data();
    const h = fitScheduleHeader(d, mono);
    expect(h).toEqual({
      boardName: 'DB2',
      boardNameSize: 14,
      place: 'Site · Plant room',
      supply: d.supply,
      document: d.document,
      footerName: 'DB2',
    });
  });

  it('steps a long name down in size rather than shortening it, and the brand column fits the header', async () => {
    const measure = await printFontMeasure();
    const h = fitScheduleHeader(data({ boardName: LONG_NAME }), measure);
    expect(h.boardName).toBe(LONG_NAME);
    expect(h.boardNameSize).toBeLessThan(14);
    // Organisation, title, name and place, line by line with the gaps between (the document's styles)
    const line = PAGE.lineHeight / PAGE.fontSize;
    const height =
      line * HEADER.orgSize +
      HEADER.titleGap +
      line * HEADER.titleSize +
      HEADER.nameGap +
      countLines(h.boardName, HEADER.brandWidth - HEADER.brandPadRight, measure, h.boardNameSize, true) *
        line *
        h.boardNameSize +
      HEADER.placeGap +
      countLines(h.place, HEADER.brandWidth - HEADER.brandPadRight, measure, HEADER.placeSize) *
        line *
        HEADER.placeSize;
    expect(height).toBeLessThanOrEqual(HEADER.contentHeight);
  });

  it('shortens a name too long for the smallest size, with an ellipsis, and still fits', () => {
    const name = `${'Board with a very long name '.repeat(6)}end`;
    const h = fitScheduleHeader(data({ boardName: name, location: 'x'.repeat(200) }), mono);
    expect(h.boardNameSize).toBe(HEADER.nameSizes.at(-1));
    expect(h.boardName.endsWith('…')).toBe(true);
    expect(name.startsWith(h.boardName.slice(0, -1))).toBe(true);
    // A place of two lines at most
    expect(countLines(h.place, HEADER.brandWidth - HEADER.brandPadRight, mono, HEADER.placeSize)).toBeLessThanOrEqual(
      2,
    );
    expect(h.place.endsWith('…')).toBe(true);
  });

  it('keeps the way of a long "Fed from" and shortens the board’s name in it when the eight rows are full', () => {
    const d = data();
    d.supply[2] = { label: 'Fed from', value: `${LONG_NAME}, way 12L3` };
    const [fed] = fitFacts(d.supply, mono).filter((f) => f.label === 'Fed from');
    expect(fed.value).toMatch(/^Main distribution board.*…, way 12L3$/);
    expect(countLines(fed.value, VALUE_WIDTH, mono, PAGE.fontSize, true)).toBe(1);
  });

  it('lets a value wrap when the column has lines to spare, and gives them out in order', () => {
    const issued = { label: 'Issued', value: `2 Mar 2026 by ${'Alexandra Montgomery '.repeat(5)}` };
    // Three facts in eight rows: the long one keeps its three lines whole
    const few = [{ label: 'Revision', value: '3' }, { label: 'Status', value: 'Issued' }, issued];
    expect(countLines(issued.value, VALUE_WIDTH, mono, PAGE.fontSize, true)).toBe(3);
    expect(fitFacts(few, mono)).toEqual(few);
    // Seven facts: one line to spare, so the long one is shortened to two
    const many = [...few, ...['a', 'b', 'c', 'd'].map((label) => ({ label, value: label }))];
    const fitted = fitFacts(many, mono).find((f) => f.label === 'Issued')!;
    expect(fitted.value.endsWith('…')).toBe(true);
    expect(countLines(fitted.value, VALUE_WIDTH, mono, PAGE.fontSize, true)).toBe(2);
  });

  it('shortens the name in the footer’s page reference to two lines with the revision and page', () => {
    const h = fitScheduleHeader(data({ boardName: LONG_NAME }), mono);
    expect(h.footerName.endsWith('…')).toBe(true);
    const reference = `${h.footerName} · revision 3 · page 88 of 88`;
    expect(countLines(reference, HEADER.footerWidth, mono, HEADER.footerSize)).toBeLessThanOrEqual(2);
  });

  it('shortenToFit: whole when it fits, else the longest head that fits, at a word’s end when near one', () => {
    const box = { width: 100, lines: 1, size: 7 };
    // 100 pt hold 24 characters of 4 pt (one point of slack): 17 of the head, the ellipsis and the tail
    expect(shortenToFit('short text', '', box, mono)).toBe('short text');
    expect(shortenToFit('alpha bravo charlie delta echo', ', tail', box, mono)).toBe('alpha bravo charl…, tail');
    // "alphabet bravo ch": the word's end is near, so the cut is there
    expect(shortenToFit('alphabet bravo charlie delta', ', tail', box, mono)).toBe('alphabet bravo…, tail');
  });
});
