import { z } from 'zod';

/** A comment on a board (wayId null or absent) or on one of its ways. */
export const commentInputSchema = z
  .object({
    wayId: z.uuid('Pick a way of this board.').nullable().optional(),
    body: z.string().trim().min(1, 'Write a comment.').max(4000, 'Keep a comment under 4000 characters.'),
  })
  .strict();
export type CommentInput = z.infer<typeof commentInputSchema>;

/**
 * Approving (issuing) a board: the issuer types their own name as a declaration; failing ways
 * need their say-so; `revision` is the revision the confirmation showed (refused if it moved).
 */
export const approveInputSchema = z
  .object({
    acknowledgeFailures: z.boolean().optional(),
    declaration: z
      .string('Type your name to confirm the issue.')
      .trim()
      .min(1, 'Type your name to confirm the issue.')
      .max(160, 'A name has at most 160 characters.'),
    revision: z.number().int('A revision is a whole number.').min(1).max(100000).optional(),
  })
  .strict();
export type ApproveInput = z.infer<typeof approveInputSchema>;

/** Marking review comments answered (the designer, in the editor). */
export const answerCommentsSchema = z
  .object({
    commentIds: z
      .array(z.uuid('Name comments by their id.'))
      .min(1, 'Name at least one comment.')
      .max(500, 'At most 500 comments at once.'),
  })
  .strict();
export type AnswerCommentsInput = z.infer<typeof answerCommentsSchema>;

/** Returning a board to draft, with a closing comment. */
export const returnInputSchema = z
  .object({
    comment: z.string().trim().max(4000, 'Keep a comment under 4000 characters.').optional(),
  })
  .strict()
  .default({});
export type ReturnInput = z.infer<typeof returnInputSchema>;

/** A revision in a URL: an issued revision number, or `current` for the live board. */
export const revisionRefSchema = z.union([
  z.literal('current'),
  z.coerce.number().int('A revision is a whole number.').min(1, 'Revisions start at 1.').max(100000),
]);
