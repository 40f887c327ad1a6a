import { describe, expect, it } from 'vitest';

import type { ScheduleRow } from '@/features/schedule/types/schedule-table';
import type { ScheduleData } from '@/features/schedule/utils/build-schedule';
import { SCHEDULE_COLUMNS } from '@/features/schedule/utils/build-schedule';
import {
  countLines,
  PAGE,
  pageGroupHeading,
  paginateSchedule,
  rowHeight,
  scaledColumns,
  summaryHeight,
} from '@/features/schedule/utils/paginate-schedule';

/** Every character 4 pt wide: easy to reason about. */
const mono = (text: string) => text.length * 4;

function row(n: number, serves = `Circuit ${n}`): ScheduleRow {
  const cells = Object.fromEntries(SCHEDULE_COLUMNS.map((c) => [c.key, '1.0'])) as ScheduleRow['cells'];
  return { wayId: `w${n}`, cells: { ...cells, way: String(n), serves }, verdict: 'passes', spare: false, label: null };
}

function schedule(groups: number[], serves?: (n: number) => string): ScheduleData {
  let n = 0;
  return {
    organisationName: 'Org',
    boardName: 'Board',
    siteName: 'Site',
    location: '',
    boardUrl: 'http://x',
    revision: 1,
    draft: false,
    statusWord: 'Issued',
    supply: [],
    document: [],
    columns: SCHEDULE_COLUMNS.filter((c) => c.key !== 'label'),
    groups: groups.map((count, g) => ({
      heading: `Group ${g}`,
      rows: Array.from({ length: count }, () => {
        n += 1;
        return row(n, serves?.(n));
      }),
    })),
    totals: [{ label: 'Ways', value: '1' }],
    notices: [{ title: 'Test the RCDs', text: 'Press the button.' }],
    noticesNote: 'A reminder only.',
    designNotes: [],
    designValuesNote: 'Design values.',
    caution: 'Caution',
    fileName: 'x.pdf',
  };
}

const BODY = PAGE.height - PAGE.marginTop - PAGE.marginBottom - PAGE.headerHeight;

describe('counting lines', () => {
  it('wraps at spaces like a line breaker', () => {
    // 41 pt of room (one point of slack): "aaaa bbbb" is 36 pt, "aaaa bbbb cccc" is 56 pt
    expect(countLines('aaaa bbbb', 42, mono)).toBe(1);
    expect(countLines('aaaa bbbb cccc', 42, mono)).toBe(2);
    expect(countLines('', 42, mono)).toBe(1);
  });

  it('splits a word longer than the line', () => {
    expect(countLines('x'.repeat(25), 41, mono)).toBe(3);
  });
});

describe('pages of the schedule', () => {
  it('every row is printed once, in order, and no page holds more than fits', () => {
    const data = schedule([12, 12, 30, 60, 30]);
    const pages = paginateSchedule(data, mono);
    const printed = pages.flatMap((p) =>
      p.items.filter((i) => i.kind === 'row').map((i) => (i.kind === 'row' ? i.row.wayId : '')),
    );
    expect(printed).toEqual(data.groups.flatMap((g) => g.rows.map((r) => r.wayId)));
    const columns = scaledColumns(data.columns);
    for (const page of pages) {
      const used =
        PAGE.headRowHeight +
        page.items.reduce((h, i) => h + (i.kind === 'group' ? PAGE.groupHeight : rowHeight(i.row, columns, mono)), 0) +
        (page.summary ? summaryHeight(data, mono) : 0);
      expect(used).toBeLessThanOrEqual(BODY);
    }
    expect(pages.filter((p) => p.summary)).toHaveLength(1);
    expect(pages[pages.length - 1].summary).toBe(true);
  });

  it('a page that starts inside a group restates its heading, marked continued', () => {
    const pages = paginateSchedule(schedule([144]), mono);
    expect(pages.length).toBeGreaterThan(2);
    for (const [i, page] of pages.entries()) {
      if (!page.items.length) continue;
      expect(page.items[0]).toMatchObject({ kind: 'group', heading: 'Group 0', continued: i > 0 });
    }
  });

  it('says continued once on a page that starts inside a run already headed as continued', () => {
    // A run of ways resuming after an RCBO is headed "… (continued)" by buildSchedule; the 36-way
    // bench board printed "Main switch 125 A, 4-pole (continued) (continued)" on its second page
    expect(pageGroupHeading({ heading: 'Main switch 125 A, 4-pole (continued)', continued: true })).toBe(
      'Main switch 125 A, 4-pole (continued)',
    );
    expect(pageGroupHeading({ heading: 'Group 0', continued: true })).toBe('Group 0 (continued)');
    expect(pageGroupHeading({ heading: 'Group 0', continued: false })).toBe('Group 0');
  });

  it('long “serves” texts take more room, so fewer rows fit on a page', () => {
    const short = paginateSchedule(schedule([100]), mono);
    const long = paginateSchedule(
      schedule(
        [100],
        (n) => `Sockets on the north wall of the machine shop, bench ${n}, and the dust extractor control`,
      ),
      mono,
    );
    expect(long.length).toBeGreaterThan(short.length);
  });
});
