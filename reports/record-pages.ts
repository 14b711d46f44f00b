import type PDFKit from 'pdfkit';

// Pages of long record tables (a busy site-year has tens of thousands of results) drawn straight
// on the PDF document, one line a record: laying them out cell by cell as a document table costs
// seconds per thousand pages. Every line has the same height, so the page count is known before
// drawing and the rest of the report can number its pages "x of y".

export interface RecordColumn {
  header: string;
  width: number;
}

export interface RecordPageFrame {
  size: string;
  layout: 'portrait' | 'landscape';
  /** Page width and height in points for that size and layout. */
  width: number;
  height: number;
  margins: { top: number; bottom: number; left: number; right: number };
  regularFont: string;
  boldFont: string;
  /** Draws what every page of the report carries (running header, footer, draft mark). */
  decorate: (doc: PDFKit.PDFDocument, pageNumber: number) => void;
}

const FONT_SIZE = 7.5;
const LINE = 10.5;
const TITLE = 18;
const CELL_PADDING = 4;

const linesPerPage = (frame: RecordPageFrame) =>
  Math.floor((frame.height - frame.margins.top - frame.margins.bottom - TITLE - LINE) / LINE);

/** Pages a table of `rows` records takes (at least one, which says the table is empty). */
export function recordPagesNeeded(rows: number, frame: RecordPageFrame): number {
  return Math.max(1, Math.ceil(rows / linesPerPage(frame)));
}

/**
 * Draws the table on pages of its own after the document's current pages, numbering them from
 * `firstPageNumber`. A cell too long for its column is cut with an ellipsis; the workbook and the
 * record screens hold every value whole.
 */
export function drawRecordPages(
  doc: PDFKit.PDFDocument,
  frame: RecordPageFrame,
  table: { title: string; columns: RecordColumn[]; rows: string[][]; empty: string },
  firstPageNumber: number,
): number {
  const perPage = linesPerPage(frame);
  const pages = recordPagesNeeded(table.rows.length, frame);
  const left = frame.margins.left;
  const right = frame.width - frame.margins.right;
  const fitted = new Map<string, string>();
  const fit = (text: string, width: number): string => {
    const key = `${width}\u0000${text}`;
    let shown = fitted.get(key);
    if (shown === undefined) {
      shown = text;
      if (doc.widthOfString(shown) > width) {
        while (shown.length > 1 && doc.widthOfString(`${shown}…`) > width) shown = shown.slice(0, -1);
        shown = `${shown.trimEnd()}…`;
      }
      fitted.set(key, shown);
    }
    return shown;
  };
  const drawRow = (cells: string[], y: number) => {
    let x = left;
    for (const [index, column] of table.columns.entries()) {
      const text = cells[index] ?? '';
      if (text) doc.text(fit(text, column.width - CELL_PADDING), x, y, { lineBreak: false });
      x += column.width;
    }
  };

  for (let page = 0; page < pages; page++) {
    doc.addPage({ size: frame.size, layout: frame.layout, margin: 0 });
    frame.decorate(doc, firstPageNumber + page);
    let y = frame.margins.top;
    doc.font(frame.boldFont).fontSize(11.5).fillColor('black');
    doc.text(page === 0 ? table.title : `${table.title} (continued)`, left, y, { lineBreak: false });
    y += TITLE;
    doc.font(frame.boldFont).fontSize(FONT_SIZE);
    drawRow(
      table.columns.map((column) => column.header),
      y,
    );
    doc
      .moveTo(left, y + LINE - 1.5)
      .lineTo(right, y + LINE - 1.5)
      .lineWidth(0.8)
      .strokeColor('black')
      .stroke();
    y += LINE;
    doc.font(frame.regularFont).fontSize(FONT_SIZE);
    if (table.rows.length === 0) doc.text(table.empty, left, y, { lineBreak: false });
    const rows = table.rows.slice(page * perPage, (page + 1) * perPage);
    for (const cells of rows) {
      drawRow(cells, y);
      y += LINE;
      doc
        .moveTo(left, y - 1.5)
        .lineTo(right, y - 1.5)
        .lineWidth(0.3)
        .strokeColor('#aaaaaa')
        .stroke();
    }
  }
  return pages;
}
