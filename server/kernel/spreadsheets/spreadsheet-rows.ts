import { parse } from 'csv-parse';
import ExcelJS from 'exceljs';
import { Readable } from 'node:stream';
import { importColumns } from '../../contracts/lab-import.js';
import { fileTypeFromBuffer } from 'file-type';
import { AppError, invalid } from '../../errors/app-error.js';
import type { Upload } from '../files/stored-files.js';
import { checkWorkbook } from './workbook-guard.js';

export interface ImportRow<K extends string = (typeof importColumns)[number]['key']> {
  /** The spreadsheet's own row number (the header is row 1). */
  row: number;
  cells: Partial<Record<K, string>>;
}

type Columns = ReadonlyArray<{ key: string }>;

/** "collected_at [YYYY-MM-DD HH:mm, site local time]" → "collected_at". */
const headerKey = (header: string) => header.trim().split(/\s*\[/)[0]!.trim().toLowerCase();

function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  // exceljs reads a date cell as a Date whose UTC fields are the wall-clock time typed in the sheet.
  if (value instanceof Date) {
    const iso = value.toISOString();
    return iso.endsWith('T00:00:00.000Z') ? iso.slice(0, 10) : `${iso.slice(0, 10)} ${iso.slice(11, 16)}`;
  }
  if (typeof value === 'object' && 'text' in (value as object)) return String((value as { text: unknown }).text);
  if (typeof value === 'object' && 'result' in (value as object)) return cellText((value as { result: unknown }).result);
  return String(value).trim();
}

function mapHeader(headers: string[], columns: Columns): Map<number, string> {
  const known = new Set<string>(columns.map((column) => column.key));
  const map = new Map<number, string>();
  headers.forEach((header, index) => {
    const key = headerKey(header);
    if (known.has(key)) map.set(index, key);
  });
  const missing = columns.map((c) => c.key).filter((key) => ![...map.values()].includes(key));
  if (missing.length > 0) throw invalid({ file: `Missing columns: ${missing.join(', ')}` }, 'The header row does not match the template');
  return map;
}

/** Rows of an XLSX file, read with exceljs's streaming reader (first worksheet only). */
export async function* xlsxRows<K extends string>(buffer: Buffer, columns: Columns = importColumns): AsyncGenerator<ImportRow<K>> {
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(Readable.from(buffer), {
    sharedStrings: 'cache',
    worksheets: 'emit',
    hyperlinks: 'ignore',
    styles: 'cache',
  });
  let header: Map<number, string> | null = null;
  for await (const worksheet of reader) {
    for await (const row of worksheet) {
      const values = (row.values as unknown[]).slice(1).map(cellText);
      if (!header) {
        header = mapHeader(values, columns);
        continue;
      }
      if (values.every((value) => value === '')) continue;
      yield {
        row: row.number,
        cells: Object.fromEntries([...header].map(([index, key]) => [key, values[index] ?? ''])) as Partial<Record<K, string>>,
      };
    }
    break;
  }
  if (!header) throw invalid({ file: 'The workbook has no header row' });
}

/** Rows of a CSV file (comma separated, UTF-8, optional BOM), streamed through csv-parse. */
export async function* csvRows<K extends string>(buffer: Buffer, columns: Columns = importColumns): AsyncGenerator<ImportRow<K>> {
  const parser = Readable.from(buffer).pipe(parse({ bom: true, relax_column_count: true, skip_empty_lines: true, trim: true }));
  let header: Map<number, string> | null = null;
  let rowNumber = 0;
  try {
    for await (const record of parser as AsyncIterable<string[]>) {
      rowNumber += 1;
      if (!header) {
        header = mapHeader(record, columns);
        continue;
      }
      yield {
        row: rowNumber,
        cells: Object.fromEntries([...header].map(([index, key]) => [key, record[index] ?? ''])) as Partial<Record<K, string>>,
      };
    }
  } catch (error) {
    if ((error as { code?: string }).code?.startsWith('CSV_'))
      throw invalid({ file: (error as Error).message }, 'The CSV file cannot be read');
    throw error;
  }
  if (!header) throw invalid({ file: 'The file has no header row' });
}

/** An import's reach: at most this many rows, each cell at most this long. The read stops at the cap. */
export const MAX_IMPORT_ROWS = 20_000;
export const MAX_CELL_LENGTH = 1_000;

async function* capped<K extends string>(rows: AsyncGenerator<ImportRow<K>>): AsyncGenerator<ImportRow<K>> {
  let count = 0;
  for await (const row of rows) {
    count += 1;
    if (count > MAX_IMPORT_ROWS) {
      throw invalid(
        { file: `More than ${MAX_IMPORT_ROWS.toLocaleString('en-US')} rows: split the file` },
        'The file is too long to import',
      );
    }
    const long = Object.entries(row.cells).find(([, value]) => typeof value === 'string' && value.length > MAX_CELL_LENGTH);
    if (long) {
      throw invalid({ file: `Row ${row.row}, ${long[0]}: longer than ${MAX_CELL_LENGTH} characters` }, 'A cell is too long to import');
    }
    yield row;
  }
}

export const xlsxType = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

/** The rows of an uploaded XLSX (by its content) or CSV (text, named .csv); anything else is a 415. */
export async function spreadsheetRows<K extends string>(
  file: Upload | undefined,
  columns: Columns = importColumns,
): Promise<AsyncGenerator<ImportRow<K>>> {
  if (!file || file.size === 0) throw invalid({ file: 'Attach an XLSX or CSV file' });
  const type = await fileTypeFromBuffer(file.buffer);
  if (type?.mime === xlsxType) {
    await checkWorkbook(file.buffer);
    return capped(xlsxRows<K>(file.buffer, columns));
  }
  const looksLikeText = !type && !file.buffer.subarray(0, 4096).includes(0);
  if (looksLikeText && /\.csv$/i.test(file.originalname)) return capped(csvRows<K>(file.buffer, columns));
  throw new AppError(415, 'unsupported_file', 'Import an XLSX or CSV file', {
    file: 'This file is neither an Excel workbook (XLSX) nor a CSV file',
  });
}

/** The 400 answer of a commit refused for its row errors, carrying the whole report. */
export function rowErrors<R extends { errors: unknown[] }>(report: R): AppError {
  return new AppError(
    400,
    'invalid_rows',
    `${report.errors.length} row error(s): nothing was imported`,
    { file: 'See the row errors' },
    { report },
  );
}
