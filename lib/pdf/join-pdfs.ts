import 'server-only';

import { PDFDocument } from 'pdf-lib';

/** One PDF of several, their pages in order (the site pack: its own pages, then each schedule). */
export async function joinPdfs(parts: readonly Uint8Array[], title?: string): Promise<Uint8Array> {
  const out = await PDFDocument.create();
  for (const part of parts) {
    const doc = await PDFDocument.load(part);
    const pages = await out.copyPages(doc, doc.getPageIndices());
    for (const page of pages) out.addPage(page);
  }
  if (title) out.setTitle(title);
  out.setProducer('Boardwright');
  return out.save();
}
