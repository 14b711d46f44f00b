import ExcelJS from 'exceljs';
import { importColumns } from '../../contracts/lab-import.js';

/** The import template: headers with their units and formats, and one example row that imports as it is. */
export async function importTemplate(format: 'xlsx' | 'csv', example: { pointCode: string }): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Decant';
  const sheet = workbook.addWorksheet('Results');
  sheet.addRow(importColumns.map((column) => (column.hint ? `${column.key} [${column.hint}]` : column.key)));
  const now = new Date();
  const day = (offset: number) => new Date(now.getTime() - offset * 86_400_000).toISOString().slice(0, 10);
  sheet.addRow([
    'Example Laboratory',
    'ACC-0000',
    `EXAMPLE-${now.getTime()}`,
    day(5),
    example.pointCode,
    `${day(7)} 09:30`,
    'Sampler name',
    'grab',
    'yes',
    '3.8',
    'COC-0001',
    'oil-grease-hem',
    '1664B',
    '',
    '18.2',
    'mg/L',
    '1.4',
    '5.0',
    `${day(6)} 10:00`,
  ]);
  sheet.getRow(1).font = { bold: true };
  sheet.columns.forEach((column) => (column.width = 24));
  // Keep every cell as text, so Excel does not turn dates and codes into something else.
  sheet.eachRow((row) => row.eachCell((cell) => (cell.numFmt = '@')));
  const buffer = format === 'xlsx' ? await workbook.xlsx.writeBuffer() : await workbook.csv.writeBuffer();
  return Buffer.from(buffer as ArrayBuffer);
}
