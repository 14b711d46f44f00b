import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import pdfmake from 'pdfmake';
import type PDFKit from 'pdfkit';
import type { TDocumentDefinitions } from 'pdfmake/interfaces.js';

/**
 * pdfmake with the shipped Noto Sans (the .woff files; fontkit cannot read .woff2). The latin
 * subset covers Western European text; characters outside it print as boxes.
 */
const require = createRequire(import.meta.url);
export const fontFile = (weight: 400 | 700): string => require.resolve(`@fontsource/noto-sans/files/noto-sans-latin-${weight}-normal.woff`);
const fontDir = dirname(fontFile(400));

let configured = false;
function configure(): void {
  if (configured) return;
  pdfmake.setFonts({ NotoSans: { normal: fontFile(400), bold: fontFile(700), italics: fontFile(400), bolditalics: fontFile(700) } });
  pdfmake.setUrlAccessPolicy(() => false);
  pdfmake.setLocalAccessPolicy((path) => path.startsWith(fontDir));
  configured = true;
}

/**
 * Lays out the document; `after`, when given, draws more pages on the same PDF document (the
 * record-table pages) before it is closed.
 */
export async function renderPdf(definition: TDocumentDefinitions, after?: (doc: PDFKit.PDFDocument) => void): Promise<Buffer> {
  configure();
  const output = pdfmake.createPdf({ ...definition, defaultStyle: { font: 'NotoSans', fontSize: 9, ...definition.defaultStyle } });
  if (after) after((await output.getStream()) as PDFKit.PDFDocument);
  return output.getBuffer();
}
