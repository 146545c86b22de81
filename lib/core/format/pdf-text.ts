import type { PDFFont } from 'pdf-lib';

/**
 * Text a standard PDF font can draw: those fonts speak WinAnsi only, so accents are taken off and
 * anything else becomes '?' (an odd name never crashes a PDF). Used by every PDF Boreline prints.
 */
export function pdfSafeText(font: PDFFont, text: string): string {
  return [...text.normalize('NFKD').replace(/[\u0300-\u036f]/g, '')]
    .map((ch) => {
      try {
        font.encodeText(ch);
        return ch;
      } catch {
        return '?';
      }
    })
    .join('');
}
