import { pdfHeaders, renderLabelStripsPdf } from '@/features/schedule/render-schedule';
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
    // Render
    const { pdf, fileName } = await renderLabelStripsPdf(source);
    return new Response(pdf as BodyInit, { headers: pdfHeaders(fileName, query.download === '1') });
  },
});
