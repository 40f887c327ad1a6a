// pdfkit ships no types; the little of it lib/pdf/pdfkit-font-reuse.ts uses (its document class,
// whose prototype's font() it wraps). react-pdf depends on the same version (package.json).
declare module 'pdfkit' {
  const PDFDocument: { prototype: object };
  export default PDFDocument;
}
