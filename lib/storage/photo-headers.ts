/** The headers of a photo answer: its sniffed type, shown inline, cached privately. */
export function photoHeaders(file: { contentType: string; fileName: string; length?: number }): HeadersInit {
  const safeName = file.fileName.replace(/[^\w.\- ]+/g, '_') || 'photo';
  return {
    'Content-Type': file.contentType,
    'Content-Disposition': `inline; filename="${safeName}"`,
    'Cache-Control': 'private, max-age=3600',
    ...(file.length !== undefined ? { 'Content-Length': String(file.length) } : {}),
  };
}
