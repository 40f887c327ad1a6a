import { answerPrint } from '@/features/schedule/print/print-files';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';

/**
 * GET /api/boards/:boardId/schedule[?revision=N][&download=1]: the board schedule as a PDF,
 * A4 landscape. Installers get issued revisions only.
 */
export const GET = defineRoute({
  action: 'schedule.print',
  params: idParamsSchema,
  // The stored file of an issued revision (or 304), else rendered in the print pool (and stored when issued)
  handler: ({ req, actor, params: { boardId } }) => answerPrint('schedule', { req, actor, boardId }),
});
