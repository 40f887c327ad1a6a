import { BOARD_STATUSES, type BoardStatus } from '@/lib/domain';
import { BOARD_STATUS_NAMES } from '@/lib/names';

/** The lifecycle stages in their order, with the words the filter shows. */
export const BOARD_STAGES: readonly { value: BoardStatus; label: string }[] = BOARD_STATUSES.map((value) => ({
  value,
  label: BOARD_STATUS_NAMES[value],
}));

const order = new Map<string, number>(BOARD_STAGES.map((s, i) => [s.value, i]));

/** Where a stage sits in the lifecycle (draft first), for sorting. */
export function stageOrder(status: BoardStatus): number {
  return order.get(status) ?? BOARD_STAGES.length;
}
