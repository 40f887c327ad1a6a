/**
 * A board's lifecycle: the one table that says which events may happen in which status, the
 * status each leads to, the audit action that records it and who hears of it. The DAL applies
 * the outcome (under the board's lock); nothing else decides a status change.
 *
 * Pure and dependency-free apart from type imports and lib/names.ts, so the server, client
 * components and the unit tests read the same table.
 *
 * Archiving, restoring and deleting are not here: they set flags beside the status (an archived
 * board keeps its status and refuses every write), and `lib/boards/record-rules.ts` decides them.
 */
import type { BoardStatus, LabelStatus } from '@/lib/domain';
import { BOARD_STATUS_PHRASES } from '@/lib/names';

export const LIFECYCLE_EVENTS = [
  /** The designer saves the board (an issued board's save starts its next revision as a draft). */
  'save',
  /** The designer sends the draft for review. */
  'submit',
  /** The inspector approves the board in review: it is issued. */
  'approve',
  /** The inspector returns the board in review to draft with comments. */
  'return',
  /** A label check leaves every way's label matching the schedule. */
  'labels-all-match',
  /** A label check leaves some way unchecked, wrong or missing. */
  'label-not-matching',
] as const;
export type LifecycleEvent = (typeof LIFECYCLE_EVENTS)[number];

/** Who is told of a transition, and with which template of lib/mail/templates.ts. */
export type LifecycleNotice =
  | { template: 'review-requested'; to: 'inspectors' }
  | { template: 'issued'; to: 'designers' }
  | { template: 'returned'; to: 'designers' };

/**
 * The audit actions a status change writes: each is an `AuditAction` of lib/dal/audit.ts (the DAL
 * passes them to `audit()`, so the compiler checks it) that the audit screen describes (a unit test checks that).
 */
export type LifecycleAuditAction =
  | 'board.saved'
  | 'board.status'
  | 'review.approved'
  | 'review.returned'
  | 'board.labels-matched'
  | 'board.labels-unmatched';

/** An allowed event: where it leads and what it records and sends. */
export type LifecycleStep = {
  refused: false;
  from: BoardStatus;
  to: BoardStatus;
  /** The audit action of the status change; null when the event leaves the status as it was. */
  audit: LifecycleAuditAction | null;
  notify: readonly LifecycleNotice[];
  /** The board's revision number moves on (a change to an issued board starts the next one). */
  startsRevision: boolean;
  /** The person must confirm first, because the event undoes something recorded on site. */
  needsConfirmation: boolean;
};

/** A refused event, with the words the caller shows (always 409: the board's stage is wrong). */
export type LifecycleRefusal = { refused: true; status: 409; message: string };

export type LifecycleOutcome = LifecycleStep | LifecycleRefusal;

/** What the refusals name besides the status. */
export type LifecycleContext = { revision: number };

type Allowed = Omit<LifecycleStep, 'refused' | 'from'>;
type Entry = Allowed | ((ctx: LifecycleContext) => string);

const stay = (status: BoardStatus): Allowed => ({
  to: status,
  audit: null,
  notify: [],
  startsRevision: false,
  needsConfirmation: false,
});

const inReviewOnly = (verb: string) => (status: BoardStatus) => () =>
  `Only a board in review can be ${verb}; this board is ${BOARD_STATUS_PHRASES[status]}.`;
const approveRefused = inReviewOnly('approved');
const returnRefused = inReviewOnly('returned');
const walkRefused = () => 'The label walk is for issued boards; this board has not been issued yet.';
const submitRefused = (words: (ctx: LifecycleContext) => string) => (ctx: LifecycleContext) =>
  `Only a draft can be sent for review; this board is ${words(ctx)}.`;

const saveStartsRevision: Allowed = {
  to: 'draft',
  audit: 'board.saved',
  notify: [],
  startsRevision: true,
  needsConfirmation: false,
};

/** The table: every status × every event, allowed (with its outcome) or refused (with why). */
const TABLE: Record<BoardStatus, Record<LifecycleEvent, Entry>> = {
  draft: {
    save: { ...stay('draft'), audit: 'board.saved' },
    submit: {
      to: 'in-review',
      audit: 'board.status',
      notify: [{ template: 'review-requested', to: 'inspectors' }],
      startsRevision: false,
      needsConfirmation: false,
    },
    approve: approveRefused('draft'),
    return: returnRefused('draft'),
    'labels-all-match': walkRefused,
    'label-not-matching': walkRefused,
  },
  'in-review': {
    save: () => 'The board is in review; it can be changed once the inspector returns it.',
    submit: submitRefused(() => 'already in review'),
    approve: {
      to: 'issued',
      audit: 'review.approved',
      notify: [{ template: 'issued', to: 'designers' }],
      startsRevision: false,
      needsConfirmation: false,
    },
    return: {
      to: 'draft',
      audit: 'review.returned',
      notify: [{ template: 'returned', to: 'designers' }],
      startsRevision: false,
      needsConfirmation: false,
    },
    'labels-all-match': walkRefused,
    'label-not-matching': walkRefused,
  },
  issued: {
    save: saveStartsRevision,
    submit: submitRefused(
      ({ revision }) => `already issued (revision ${revision}); a change to it starts the next revision`,
    ),
    approve: approveRefused('issued'),
    return: returnRefused('issued'),
    'labels-all-match': { ...stay('labels-matched'), audit: 'board.labels-matched' },
    'label-not-matching': stay('issued'),
  },
  'labels-matched': {
    save: saveStartsRevision,
    submit: submitRefused(
      ({ revision }) =>
        `already issued (revision ${revision}) and its labels matched on site; a change to it starts the next revision`,
    ),
    approve: approveRefused('labels-matched'),
    return: returnRefused('labels-matched'),
    'labels-all-match': stay('labels-matched'),
    'label-not-matching': { ...stay('issued'), audit: 'board.labels-unmatched', needsConfirmation: true },
  },
};

/** What `event` does to a board in `status`: the step to take, or why it is refused. */
export function transition(status: BoardStatus, event: LifecycleEvent, ctx: LifecycleContext): LifecycleOutcome {
  const entry = TABLE[status][event];
  if (typeof entry === 'function') return { refused: true, status: 409, message: entry(ctx) };
  return { refused: false, from: status, ...entry };
}

/** The walk's event after a label check: every way's label matching, or not (a board with no ways never matches). */
export function labelsEvent(labels: readonly LabelStatus[]): LifecycleEvent {
  return labels.length > 0 && labels.every((l) => l === 'matches') ? 'labels-all-match' : 'label-not-matching';
}

/** Whether a board in this status can be changed where it stands (not frozen, not waiting for review). */
export function editableInPlace(status: BoardStatus): boolean {
  return status === 'draft';
}
