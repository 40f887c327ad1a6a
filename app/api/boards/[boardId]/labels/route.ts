import { pdfResponse, printPdf } from '@/features/schedule/print/print-files';
import { parsePrintQuery } from '@/features/schedule/utils/print-query';
import { defineRoute } from '@/lib/api/handler';
import { idParamsSchema } from '@/lib/boards/schemas';
import { getScheduleSource } from '@/lib/dal/schedule-source';

/**
 * GET /api/boards/:boardId/labels[?revision=N][&download=1]: printable way labels sized to
 * the module pitch, in rail order. The same revisions as the schedule may be printed.
 */
export const GET = defineRoute({
  action: 'schedule.print',
  params: idParamsSchema,
  handler: async ({ req, actor, params: { boardId } }) => {
    // Query
    const query = parsePrintQuery(req.url);
    // The board state (ownership and the installers' rule in the DAL)
    const source = await getScheduleSource(actor, boardId, query.revision);
    // The stored file of an issued revision, else rendered in the print pool (and stored when issued)
    return pdfResponse(await printPdf('labels', source), query.download === '1');
  },
});
