import zlib from 'node:zlib';
import { PDFArray, PDFDocument, PDFName, PDFRawStream, type PDFObject } from 'pdf-lib';

/** The text a pdf-lib document shows with standard fonts, page by page (hex strings shown with Tj). */
export async function extractPdfText(bytes: Uint8Array): Promise<string[]> {
  const doc = await PDFDocument.load(bytes);
  return doc.getPages().map((page) => {
    const contents = page.node.Contents();
    const streams: PDFObject[] =
      contents instanceof PDFArray ? contents.asArray().map((r) => doc.context.lookup(r)!) : contents ? [contents] : [];
    let out = '';
    for (const s of streams) {
      if (!(s instanceof PDFRawStream)) continue;
      const data = s.dict.get(PDFName.of('Filter'))
        ? zlib.inflateSync(Buffer.from(s.contents))
        : Buffer.from(s.contents);
      for (const m of data.toString('latin1').matchAll(/<([0-9A-Fa-f]*)>\s*Tj/g))
        out += Buffer.from(m[1], 'hex').toString('latin1') + '\n';
    }
    return out;
  });
}
