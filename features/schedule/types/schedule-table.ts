/** The schedule's table as the PDF and the browser draw it: plain data, safe for the browser. */
import type { LabelStatus } from '@/lib/domain';
import type { Verdict } from '@/lib/sizing';

export type ColumnKey =
  | 'way'
  | 'serves'
  | 'load'
  | 'protection'
  | 'ib'
  | 'cable'
  | 'conductors'
  | 'run'
  | 'iz'
  | 'vd'
  | 'r1r2'
  | 'zs'
  | 'result'
  | 'label';

export type ScheduleColumn = {
  key: ColumnKey;
  heading: string;
  /** Share of the table width, in points on A4 landscape. */
  width: number;
  align: 'left' | 'right' | 'center';
};

export type ScheduleRow = {
  wayId: string;
  cells: Record<ColumnKey, string>;
  verdict: Verdict | null;
  spare: boolean;
  label: LabelStatus | null;
};

export type ScheduleGroup = { heading: string; rows: ScheduleRow[] };
