/**
 * The rules that keep Boardwright's records: what removing a site or a board does, who may
 * issue a board and as which revision, and when the walk asks before a label check changes a
 * board's state (the change itself is in lib/boards/lifecycle.ts). Pure functions over plain
 * facts, so the DAL (which gathers the facts under a lock) and the UI (which explains them
 * before the click) answer the same, and the unit tests cover them directly.
 */
import { can } from '@/lib/auth/permissions';
import { labelCheckEvent, transition } from '@/lib/boards/lifecycle';
import type { BoardStatus, LabelStatus, Role } from '@/lib/domain';

/** A rule's "no", with the words the caller shows. */
export type Refusal = { refused: true; status: 403 | 409; message: string };

/** What removing a board does: a never-issued board is deleted (undoable), an issued one archived. */
export type BoardRemoval = { refused: false; effect: 'delete' | 'archive' } | Refusal;

/**
 * Removing a board. A board that was never issued may be deleted by whoever may discard
 * boards (the delete keeps the rows for undo). A board that was ever issued is never deleted:
 * only a role that may archive records archives it.
 */
export function boardRemoval(role: Role, facts: { everIssued: boolean; archived: boolean }): BoardRemoval {
  if (facts.archived) return { refused: true, status: 409, message: 'This board is archived already.' };
  if (!facts.everIssued) {
    return can(role, 'boards.discard')
      ? { refused: false, effect: 'delete' }
      : { refused: true, status: 403, message: 'Your role may not delete boards.' };
  }
  return can(role, 'records.archive')
    ? { refused: false, effect: 'archive' }
    : {
        refused: true,
        status: 403,
        message: 'This board has been issued, so it is kept: only an admin may archive it.',
      };
}

/** Removing a site always archives it; one that holds an issued board only by an admin. */
export function siteRemoval(
  role: Role,
  facts: { holdsIssued: boolean; archived: boolean },
): { refused: false } | Refusal {
  if (facts.archived) return { refused: true, status: 409, message: 'This site is archived already.' };
  if (can(role, 'records.archive')) return { refused: false };
  if (!can(role, 'boards.discard')) return { refused: true, status: 403, message: 'Your role may not archive sites.' };
  return facts.holdsIssued
    ? {
        refused: true,
        status: 403,
        message: 'This site holds a board that has been issued, so it is kept: only an admin may archive it.',
      }
    : { refused: false };
}

/** Restoring an archived site or board (admins), or undoing the delete of a draft board. */
export function mayRestore(role: Role, what: 'archived' | 'deleted'): boolean {
  return what === 'archived' ? can(role, 'records.archive') : can(role, 'boards.discard');
}

/**
 * Separation of duties: a board is issued by someone other than the person who last changed
 * its design, unless the organisation allows self-issue (one-person firms). Admins follow the
 * same rule. Null when the issuer may issue.
 */
export function issueRefusal(facts: {
  issuerId: string;
  designChangedById: string | null;
  allowSelfIssue: boolean;
}): Refusal | null {
  if (facts.allowSelfIssue || !facts.designChangedById || facts.designChangedById !== facts.issuerId) return null;
  return {
    refused: true,
    status: 403,
    message:
      'You made the last change to this design, so someone else must issue it (an admin may allow self-issue in the organisation’s settings).',
  };
}

/** The revision a board at `revision` would be issued as, when `lastIssued` (0: none) was issued last. */
export function revisionAfter(revision: number, lastIssued: number): number {
  return Math.max(revision, lastIssued + 1);
}

/** Names compared as people type them: case, spacing and accents aside. */
export function sameName(typed: string, name: string): boolean {
  const norm = (s: string) => s.normalize('NFKD').replace(/\p{M}/gu, '').replace(/\s+/g, ' ').trim().toLowerCase();
  return norm(typed).length > 0 && norm(typed) === norm(name);
}

/**
 * Whether recording `next` on one way would take a fully confirmed (labels-matched) board back to
 * issued: the label walk asks before it does (lib/boards/lifecycle.ts decides).
 */
export function labelChangeUnverifies(status: BoardStatus, next: LabelStatus): boolean {
  const out = transition(status, labelCheckEvent(next), { revision: 0 });
  return !out.refused && out.needsConfirmation;
}
