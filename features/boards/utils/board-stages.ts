import type { BoardStatus } from '@/lib/domain';

/** The lifecycle stages in their order, with the words the filter shows. */
export const BOARD_STAGES = [
  { value: 'draft', label: 'Draft' },
  { value: 'in-review', label: 'In review' },
  { value: 'issued', label: 'Issued' },
  { value: 'verified', label: 'Verified' },
] as const satisfies readonly { value: BoardStatus; label: string }[];

const order = new Map<string, number>(BOARD_STAGES.map((s, i) => [s.value, i]));

/** Where a stage sits in the lifecycle (draft first), for sorting. */
export function stageOrder(status: BoardStatus): number {
  return order.get(status) ?? BOARD_STAGES.length;
}
