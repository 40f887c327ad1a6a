// The board's types are derived from its one schema module.
export type { BoardDto, BoardSummary, WayDto } from './schemas';
