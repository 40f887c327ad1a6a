/**
 * The app's fixed vocabularies, in a module with no dependencies so that client
 * components can use them without pulling in the database layer.
 */
export const ROLES = ['admin', 'designer', 'inspector', 'installer'] as const;
export type Role = (typeof ROLES)[number];

/**
 * A board's stages. `labels-matched`: issued, and an installer found every way's label on site
 * matching the schedule (was `verified` before migration 0007; it is not an inspection).
 */
export const BOARD_STATUSES = ['draft', 'in-review', 'issued', 'labels-matched'] as const;
export type BoardStatus = (typeof BOARD_STATUSES)[number];

export const LABEL_STATUSES = ['unchecked', 'matches', 'wrong', 'missing'] as const;
export type LabelStatus = (typeof LABEL_STATUSES)[number];
