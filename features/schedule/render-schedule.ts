import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import { createElement, type ReactElement } from 'react';

import type { ScheduleSource } from '@/lib/dal/schedule-source';

import { LabelStripsDocument } from './components/label-strips-document';
import { ScheduleDocument } from './components/schedule-document';
import { buildLabelSheet, fitLabelTexts } from './utils/build-labels';
import { buildSchedule } from './utils/build-schedule';
import { fitScheduleHeader } from './utils/fit-header';
import { printFontMeasure } from './utils/fonts';
import { paginateSchedule } from './utils/paginate-schedule';
import { boardQrCode } from './utils/qr-code';

import type { RenderedPdf } from './print/print-job';

/** The board schedule PDF (A4 landscape) of a board state. */
export async function renderSchedulePdf(source: ScheduleSource, now = new Date()): Promise<RenderedPdf> {
  const data = buildSchedule(source, now);
  const [qrDataUrl, measure] = await Promise.all([boardQrCode(data.boardUrl), printFontMeasure()]);
  const pages = paginateSchedule(data, measure);
  const header = fitScheduleHeader(data, measure);
  const element = createElement(ScheduleDocument, {
    data,
    header,
    qrDataUrl,
    pages,
  }) as unknown as ReactElement<DocumentProps>;
  const buffer = await renderToBuffer(element);
  return { pdf: new Uint8Array(buffer), fileName: data.fileName };
}

/** The label strips PDF of a board state, drawn to the module pitch. */
export async function renderLabelStripsPdf(source: ScheduleSource): Promise<RenderedPdf> {
  const sheet = fitLabelTexts(buildLabelSheet(source), await printFontMeasure());
  const element = createElement(LabelStripsDocument, { sheet }) as unknown as ReactElement<DocumentProps>;
  const buffer = await renderToBuffer(element);
  return { pdf: new Uint8Array(buffer), fileName: sheet.fileName };
}
