import { createRequire } from 'node:module';
import { dirname } from 'node:path';
import pdfmake from 'pdfmake';
import type { TDocumentDefinitions } from 'pdfmake/interfaces.js';

/**
 * pdfmake with the shipped Noto Sans (the .woff files; fontkit cannot read .woff2). The latin
 * subset covers Western European text; characters outside it print as boxes.
 */
const require = createRequire(import.meta.url);
const font = (weight: number) => require.resolve(`@fontsource/noto-sans/files/noto-sans-latin-${weight}-normal.woff`);
const fontDir = dirname(font(400));

let configured = false;
function configure(): void {
  if (configured) return;
  pdfmake.setFonts({ NotoSans: { normal: font(400), bold: font(700), italics: font(400), bolditalics: font(700) } });
  pdfmake.setUrlAccessPolicy(() => false);
  pdfmake.setLocalAccessPolicy((path) => path.startsWith(fontDir));
  configured = true;
}

export async function renderPdf(definition: TDocumentDefinitions): Promise<Buffer> {
  configure();
  return pdfmake.createPdf({ ...definition, defaultStyle: { font: 'NotoSans', fontSize: 9, ...definition.defaultStyle } }).getBuffer();
}
