import type { Role } from '@/lib/domain';

/**
 * What each role may do: this table is the one place that says it. Every route handler and server action
 * asks `can(role, action)` on the server; the UI only hides what the server refuses anyway.
 */
export const PERMISSIONS = {
  'members.manage': ['admin'],
  'boards.read': ['admin', 'designer', 'inspector', 'installer'],
  'boards.edit': ['admin', 'designer'],
  'sizing.run': ['admin', 'designer', 'inspector'],
  'boards.submit': ['admin', 'designer'],
  'boards.review': ['admin', 'inspector'],
  'schedule.print': ['admin', 'designer', 'inspector', 'installer'],
  // Print a board's live draft (not yet issued); installers print issued revisions only
  'schedule.print-draft': ['admin', 'designer', 'inspector'],
  'walk.record': ['admin', 'inspector', 'installer'],
  'mailbox.read': ['admin'],
  // Archive sites and boards that were ever issued, and restore anything archived
  'records.archive': ['admin'],
  // Delete a board that was never issued (with undo), archive a site that holds none
  'boards.discard': ['admin', 'designer'],
  // Mark review comments answered
  'comments.answer': ['admin', 'designer'],
  // The organisation's settings (e.g. whether a designer may issue their own design)
  'organisation.manage': ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof PERMISSIONS;

/** True when the role may perform the action. */
export function can(role: Role, action: Action): boolean {
  return (PERMISSIONS[action] as readonly Role[]).includes(role);
}

export const ACTION_WORDS: Record<Action, string> = {
  'members.manage': 'manage members',
  'boards.read': 'read boards',
  'boards.edit': 'edit sites and boards',
  'sizing.run': 'run sizing',
  'boards.submit': 'send boards for review',
  'boards.review': 'review boards',
  'schedule.print': 'print schedules',
  'schedule.print-draft': 'print boards not yet issued',
  'walk.record': 'record label walks',
  'mailbox.read': 'read the development mailbox',
  'records.archive': 'archive or restore issued records',
  'boards.discard': 'delete draft boards',
  'comments.answer': 'mark review comments answered',
  'organisation.manage': 'change the organisation’s settings',
};
