import type { BoardStatus } from '@/lib/domain';
import type { LabelStatus } from '@/lib/domain';

import type { WayCounts } from './counts';
import type { BoardSettings, WayInput } from './schemas';

/** A way as the API hands it to the client. */
export type WayDto = WayInput & { labelStatus: LabelStatus; labelNote: string };

/** A board as the API hands it to the client: plain data, never a model instance. */
export type BoardDto = BoardSettings & {
  id: string;
  siteId: string;
  siteName: string;
  status: BoardStatus;
  version: number;
  revision: number;
  updatedAt: string;
  ways: WayDto[];
};

export type BoardSummary = {
  id: string;
  siteId: string;
  siteName: string;
  name: string;
  location: string;
  phases: 1 | 3;
  status: BoardStatus;
  revision: number;
  /** Ways by way number (counts.ts), the same as `counts.ways`. */
  wayCount: number;
  counts: WayCounts;
  updatedAt: string;
  /** When the board (or its site) was archived; null for a live board. */
  archivedAt: string | null;
  /** Whether a revision of it was ever issued (then it is archived, never deleted). */
  everIssued: boolean;
};
