import { z } from 'zod';

/** A comment on a board (wayId null or absent) or on one of its ways. */
export const commentInputSchema = z
  .object({
    wayId: z.uuid('Pick a way of this board.').nullable().optional(),
    body: z.string().trim().min(1, 'Write a comment.').max(4000, 'Keep a comment under 4000 characters.'),
  })
  .strict();
export type CommentInput = z.infer<typeof commentInputSchema>;

/** Approving a board; failing ways need the reviewer's say-so. */
export const approveInputSchema = z
  .object({ acknowledgeFailures: z.boolean().optional() })
  .strict()
  .default({});
export type ApproveInput = z.infer<typeof approveInputSchema>;

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
