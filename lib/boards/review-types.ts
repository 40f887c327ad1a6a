/** What the review, revisions, return notes and a refused review request answer: plain data, safe for the browser. */
import type { Refusal } from '@/lib/boards/record-rules';
import type { BoardDto } from '@/lib/boards/types';
import type { FieldIssue } from '@/lib/errors';
import type { BoardResult } from '@/lib/sizing';

/** A comment on a board or one of its ways. */
export type CommentDto = {
  id: string;
  wayId: string | null;
  revision: number;
  body: string;
  authorName: string;
  createdAt: string;
  /** When the designer marked it answered; null while open. */
  answeredAt: string | null;
};

/** A returned board's review as the designer reads it in the editor. */
export type ReturnNotes = {
  revision: number;
  returnedByName: string;
  returnedAt: string;
  /** Comments on the whole board: the reason for the return, open ones only. */
  reasons: CommentDto[];
  /** Open comments on single ways, to show beside them. */
  wayComments: CommentDto[];
  /** How many comments of this return are answered already. */
  answered: number;
};

/** What an issue would issue now, for the confirmation, and whether the caller may. */
export type IssuePreview = {
  /** The revision number the board would be issued as. */
  revision: number;
  /** The ways counted by way number, in the words of the boards list and the schedule. */
  ways: string;
  /** Devices on the rail, and ways with a circuit (recorded in the audit trail). */
  devices: number;
  circuits: number;
  verdicts: { passes: number; nearLimit: number; fails: number };
  /** Why the caller may not issue it (separation of duties), or null. */
  refusal: Refusal | null;
};

/** Everything the review page shows. */
export type ReviewData = {
  board: BoardDto;
  organisationName: string;
  sizing: BoardResult | null;
  /** Why the board could not be sized (empty when it could). */
  sizingIssues: FieldIssue[];
  /** Printed way reference per way id (null for devices without one). */
  refs: Record<string, string | null>;
  comments: CommentDto[];
  revisions: RevisionSummary[];
  issue: IssuePreview;
};

export type RevisionSummary = {
  revision: number;
  issuedAt: string;
  issuedByName: string;
  /** The issuer's typed name (null for revisions issued before declarations were asked). */
  declaration: string | null;
};

export type ScheduleMail = {
  id: string;
  to: string;
  revision: number;
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
  lastError: string | null;
  sentByName: string;
  createdAt: string;
  sentAt: string | null;
};

/** When and by whom a board was archived (itself, or through its site); null when it is not. */
export type ArchiveState = { at: string; byName: string; through: 'board' | 'site' } | null;

/** One way that stops a board going for review, as the refusal lists it. */
export type FailingWay = {
  wayId: string;
  /** The way reference (e.g. "3" or "2L1"), null for a device without one. */
  label: string | null;
  serves: string;
  /** The messages of the checks it fails. */
  problems: string[];
};

/** A board-level check that fails (incoming device, busbar, modules, poles). */
export type FailingBoardCheck = { code: string; message: string; reference: string };
