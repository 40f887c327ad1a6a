'use client';

import { cn } from '@/lib/cn';
import { useInBrowser } from '@/lib/use-in-browser';

import type { ScheduleColumn, ScheduleGroup } from '../types/schedule-table';

const TONES = { passes: 'text-verdict-pass', 'near-limit': 'text-verdict-near', fails: 'text-verdict-fail' } as const;

/**
 * The schedule's table of ways, drawn in the browser (`useInBrowser`): drawn on the server its
 * rows went out twice, as Server Component output and again as HTML. The server sends a box of
 * about the table's height.
 */
export function ScheduleTable({ columns, groups }: { columns: ScheduleColumn[]; groups: ScheduleGroup[] }) {
  const inBrowser = useInBrowser();
  if (!inBrowser) {
    const rows = groups.reduce((n, g) => n + g.rows.length + 1, 1);
    return <div aria-busy="true" className="mt-1" style={{ minHeight: `${rows * 29}px` }} />;
  }
  return (
    <div className="mt-1 overflow-x-auto">
      <table className="w-full border-collapse text-left">
        <thead className="bg-ink text-white">
          <tr>
            {columns.map((c) => (
              <th
                key={c.key}
                scope="col"
                className={cn('px-2 py-1.5 align-bottom font-semibold', c.align === 'right' && 'text-right')}
              >
                {c.heading}
              </th>
            ))}
          </tr>
        </thead>
        {groups.map((group, g) => (
          <tbody key={g} className="break-inside-avoid-page">
            <tr>
              <th
                colSpan={columns.length}
                scope="colgroup"
                className="bg-copper-light px-2 py-1 text-left font-semibold text-copper-dark"
              >
                {group.heading}
              </th>
            </tr>
            {group.rows.map((row) => (
              <tr key={row.wayId} className={cn('border-b border-line', row.spare && 'text-ink-faint')}>
                {columns.map((c) => (
                  <td
                    key={c.key}
                    className={cn(
                      'px-2 py-1',
                      c.align === 'right' && 'whitespace-nowrap text-right tabular-nums',
                      c.key === 'way' && 'font-bold text-ink',
                      c.key === 'result' && row.verdict && cn('font-semibold', TONES[row.verdict]),
                      c.key === 'label' &&
                        (row.label === 'wrong' || row.label === 'missing') &&
                        'font-semibold text-verdict-fail',
                    )}
                  >
                    {row.cells[c.key]}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        ))}
      </table>
    </div>
  );
}
