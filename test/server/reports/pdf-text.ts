import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

export interface PdfReading {
  /** Each page's text items joined by single spaces. */
  pages: string[];
  /** Each page's size in PDF points, [width, height]. */
  sizes: Array<[number, number]>;
}

/** A PDF's text and page sizes as pdf.js reads them (no fonts loaded, no worker). */
export async function readPdf(bytes: Buffer): Promise<PdfReading> {
  const document = await getDocument({ data: new Uint8Array(bytes), disableFontFace: true, useSystemFonts: false })
    .promise;
  const pages: string[] = [];
  const sizes: Array<[number, number]> = [];
  for (let number = 1; number <= document.numPages; number += 1) {
    const page = await document.getPage(number);
    const content = await page.getTextContent();
    pages.push(
      content.items
        .map((item) => ('str' in item ? item.str : ''))
        .join(' ')
        .replace(/\s+/g, ' '),
    );
    const [x0, y0, x1, y1] = page.view;
    sizes.push([Math.round(x1 - x0), Math.round(y1 - y0)]);
  }
  await document.destroy();
  return { pages, sizes };
}

/** Collects a binary answer (PDF, image) as a Buffer for supertest. */
export function binaryBody(
  response: NodeJS.ReadableStream,
  callback: (error: Error | null, body: Buffer) => void,
): void {
  const chunks: Buffer[] = [];
  response.on('data', (chunk: Buffer) => chunks.push(chunk));
  response.on('end', () => callback(null, Buffer.concat(chunks)));
}
