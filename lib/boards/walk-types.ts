/** What the label walk answers: plain data, safe for the browser. */
import type { BoardStatus, LabelStatus } from '@/lib/domain';

/** One way as the walk shows it: what its label should say and what was found. */
export type WalkWay = {
  id: string;
  /** The printed way reference, null for a main switch, RCD or SPD. */
  ref: string | null;
  /** The words of the label, as the schedule gives them. */
  labelText: string;
  /**
   * What the printed strip reads when it shortens `labelText` to fit the label (ending in "…");
   * absent when it prints it whole (features/schedule `withStripTexts`).
   */
  stripText?: string;
  /** How many modules wide the device is (its label is as wide). */
  modules: number;
  device: string;
  rail: number;
  status: LabelStatus;
  note: string;
  checkedByName: string | null;
  checkedAt: string | null;
  photos: AttachmentDto[];
};

export type WalkProgress = { total: number; checked: number; matches: number; wrong: number; missing: number };

export type WalkData = {
  boardId: string;
  name: string;
  siteName: string;
  location: string;
  status: BoardStatus;
  revision: number;
  ways: WalkWay[];
  progress: WalkProgress;
  /** Photos of the whole board (not of one way). */
  boardPhotos: AttachmentDto[];
};

export type AttachmentDto = {
  id: string;
  wayId: string | null;
  fileName: string;
  contentType: string;
  sizeBytes: number;
  url: string;
  thumbUrl: string;
  uploadedByName: string;
  createdAt: string;
};
