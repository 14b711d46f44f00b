import ExcelJS from 'exceljs';
import { importColumns } from '../../contracts/lab-import.js';
import { EXAMPLE_REPORT_PREFIX } from './import-plan.js';

export interface TemplateCodes {
  points: Array<{ code: string; name: string }>;
  parameters: Array<{ code: string; name: string; defaultUnit: string }>;
}

/**
 * The import template: headers with their units and formats, one example row the check refuses
 * (so it is never imported as a real certificate), and in the workbook a Codes sheet with the
 * site's discharge point and parameter codes.
 */
export async function importTemplate(format: 'xlsx' | 'csv', codes: TemplateCodes): Promise<Buffer> {
  const example = { pointCode: codes.points[0]?.code ?? 'OF-001' };
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Decant';
  const sheet = workbook.addWorksheet('Results');
  sheet.addRow(importColumns.map((column) => (column.hint ? `${column.key} [${column.hint}]` : column.key)));
  const now = new Date();
  const day = (offset: number) => new Date(now.getTime() - offset * 86_400_000).toISOString().slice(0, 10);
  sheet.addRow([
    'Example Laboratory',
    'ACC-0000',
    EXAMPLE_REPORT_PREFIX,
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
  if (format === 'xlsx') {
    const list = workbook.addWorksheet('Codes');
    list.addRow(['discharge_point_code', 'discharge point', '', 'parameter_code', 'parameter', 'usual unit']);
    list.getRow(1).font = { bold: true };
    const rows = Math.max(codes.points.length, codes.parameters.length);
    for (let i = 0; i < rows; i += 1) {
      const point = codes.points[i];
      const parameter = codes.parameters[i];
      list.addRow([point?.code ?? '', point?.name ?? '', '', parameter?.code ?? '', parameter?.name ?? '', parameter?.defaultUnit ?? '']);
    }
    list.columns.forEach((column) => (column.width = 26));
  }
  const buffer = format === 'xlsx' ? await workbook.xlsx.writeBuffer() : await workbook.csv.writeBuffer();
  return Buffer.from(buffer as ArrayBuffer);
}
