import { answerPrint } from '@/features/schedule/print/print-files';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';

/**
 * GET /api/boards/:boardId/labels[?revision=N][&download=1]: printable way labels sized to
 * the module pitch, in rail order. The same revisions as the schedule may be printed.
 */
export const GET = defineRoute({
  action: 'schedule.print',
  params: idParamsSchema,
  // The stored file of an issued revision (or 304), else rendered in the print pool (and stored when issued)
  handler: ({ req, actor, params: { boardId } }) => answerPrint('labels', { req, actor, boardId }),
});
