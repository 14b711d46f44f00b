import ExcelJS from 'exceljs';
import { PassThrough } from 'node:stream';
import type { PeriodPackInput } from '../server/contracts/period-pack.js';
import type { LimitRow } from '../server/contracts/periods.js';

import { neutralised } from '../server/contracts/csv.js';

type Cell = string | number | Date | null;
interface Column {
  header: string;
  width: number;
  /** Excel number format for numbers and dates in the column. */
  format?: string;
}

/** A calendar day as a date cell (midnight UTC, which a spreadsheet shows as that day). */
const day = (text: string | null): Date | null => (text ? new Date(`${text.slice(0, 10)}T00:00:00Z`) : null);
/** A site-time "YYYY-MM-DD HH:MM" as a date-time cell showing the same wall-clock time. */
const siteTime = (text: string | null): Date | null => (text ? new Date(`${text.replace(' ', 'T')}:00Z`) : null);
const dateFormat = 'yyyy-mm-dd';
const timeFormat = 'yyyy-mm-dd hh:mm';

type WorkbookWriter = InstanceType<typeof ExcelJS.stream.xlsx.WorkbookWriter>;

/** One sheet written row by row: the streaming writer keeps no cell objects once a row is committed. */
function sheet(workbook: WorkbookWriter, name: string, columns: Column[], rows: Iterable<Cell[]>): void {
  const ws = workbook.addWorksheet(name, { views: [{ state: 'frozen', ySplit: 1 }] });
  ws.columns = columns.map((column) => ({
    header: column.header,
    width: column.width,
    style: column.format ? { numFmt: column.format } : {},
  }));
  ws.getRow(1).font = { bold: true };
  ws.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: columns.length } };
  ws.getRow(1).commit();
  // One style object per column, shared by its cells: the writer recognises a style it has seen by
  // identity, where the copy each new cell gets would be serialised and looked up again.
  const styles = columns.map((column) => (column.format ? { numFmt: column.format } : {}));
  for (const values of rows) {
    const row = ws.addRow(values.map((cell) => (typeof cell === 'string' ? neutralised(cell) : cell)));
    for (let index = 0; index < styles.length; index++) row.getCell(index + 1).style = styles[index]!;
    row.commit();
  }
  ws.commit();
}

/**
 * Each day's discharge once per point, parameter and unit: a limit pair (daily maximum and
 * monthly average) and the versions of a limit share the same daily discharges.
 */
function* dailyDischarges(rows: LimitRow[]): Generator<Cell[]> {
  const seen = new Set<string>();
  for (const row of rows) {
    for (const d of row.dailyValues) {
      const key = `${row.pointCode}\u0000${row.parameter}\u0000${row.unit}\u0000${d.day}`;
      if (seen.has(key)) continue;
      seen.add(key);
      yield [
        day(d.day),
        row.pointCode,
        row.parameter,
        typeof d.value === 'number' ? d.value : null,
        row.unit,
        d.massLoading?.lbPerDay ?? null,
      ];
    }
  }
}

const verdict = (row: LimitRow) =>
  row.computedValue === null
    ? 'No data'
    : row.exceeded
      ? row.statistic === 'instantaneous-minimum'
        ? 'Below the limit'
        : 'Over the limit'
      : 'Within the limit';

/**
 * The period pack as a workbook: the summary, daily values, results, certificates, flows,
 * shipments and follow-ups, numbers as numbers and days as dates, units in the headers.
 */
export async function periodPackXlsx(pack: PeriodPackInput): Promise<Buffer> {
  const { summary } = pack;
  const output = new PassThrough();
  const chunks: Buffer[] = [];
  output.on('data', (chunk: Buffer) => chunks.push(chunk));
  const finished = new Promise((resolve, reject) => output.on('end', resolve).on('error', reject));
  const workbook = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: output, useStyles: true, useSharedStrings: false });
  workbook.creator = 'Decant';
  const stamp = new Date(summary.signature?.signedAt ?? summary.compiledAt);
  workbook.created = stamp;
  workbook.modified = stamp;

  sheet(
    workbook,
    'Summary',
    [
      { header: 'Point', width: 10 },
      { header: 'Parameter', width: 34 },
      { header: 'Statistic', width: 22 },
      { header: 'Applies from', width: 13, format: dateFormat },
      { header: 'Applies to', width: 13, format: dateFormat },
      { header: 'Limit', width: 10, format: '0.####' },
      { header: 'Unit', width: 9 },
      { header: 'Value (number; empty when <ML or no data)', width: 16, format: '0.####' },
      { header: 'Value as reported', width: 16 },
      { header: 'Samples taken', width: 10, format: '0' },
      { header: 'Samples required', width: 10, format: '0' },
      { header: 'Verdict', width: 16 },
    ],
    summary.rows.map((row) => [
      row.pointCode,
      row.parameter,
      row.statistic,
      day(row.appliesFrom),
      day(row.appliesTo),
      row.limitValue,
      row.unit,
      typeof row.computedValue === 'number' ? row.computedValue : null,
      row.shownValue ?? '',
      row.samplesTaken,
      row.samplesRequired,
      verdict(row),
    ]),
  );
  sheet(
    workbook,
    'Daily values',
    [
      { header: 'Day', width: 12, format: dateFormat },
      { header: 'Point', width: 10 },
      { header: 'Parameter', width: 34 },
      { header: 'Daily discharge (number; empty when <ML)', width: 16, format: '0.####' },
      { header: 'Unit', width: 9 },
      { header: 'Loading, lb/day', width: 14, format: '0.###' },
    ],
    dailyDischarges(summary.rows),
  );
  sheet(
    workbook,
    'Results',
    [
      { header: 'Sampled (site time)', width: 18, format: timeFormat },
      { header: 'Point', width: 10 },
      { header: 'Parameter', width: 34 },
      { header: 'Result as reported', width: 14 },
      { header: 'Unit', width: 8 },
      { header: 'MDL', width: 8, format: '0.###' },
      { header: 'ML', width: 8, format: '0.###' },
      { header: 'Method', width: 12 },
      { header: 'Lab', width: 30 },
      { header: 'Report number', width: 18 },
      { header: 'Findings', width: 28 },
    ],
    pack.samples.map((s) => [
      siteTime(s.sampledAt),
      s.pointCode,
      s.parameter,
      s.result,
      s.unit,
      s.mdl,
      s.ml,
      s.method,
      s.lab,
      s.reportNumber,
      s.findings.join(', '),
    ]),
  );
  sheet(
    workbook,
    'Certificates',
    [
      { header: 'Report number', width: 18 },
      { header: 'Lab', width: 30 },
      { header: 'Sampled from', width: 13, format: dateFormat },
      { header: 'Sampled to', width: 13, format: dateFormat },
      { header: 'Received', width: 13, format: dateFormat },
      { header: 'Analysed from', width: 13, format: dateFormat },
      { header: 'Analysed to', width: 13, format: dateFormat },
      { header: 'File', width: 24 },
      { header: 'SHA-256', width: 66 },
    ],
    pack.certificates.map((c) => [
      c.reportNumber,
      c.lab,
      day(c.sampledFrom),
      day(c.sampledTo),
      day(c.receivedOn),
      day(c.analysedFrom),
      day(c.analysedTo),
      c.fileName ?? '',
      c.sha256 ?? '',
    ]),
  );
  sheet(
    workbook,
    'Flows',
    [
      { header: 'Day', width: 12, format: dateFormat },
      { header: 'Point', width: 10 },
      { header: 'Flow', width: 14, format: '#,##0.####' },
      { header: 'Unit', width: 10 },
    ],
    pack.flows.map((f) => [day(f.day), f.pointCode, f.value, f.unit]),
  );
  sheet(
    workbook,
    'Shipments',
    [
      { header: 'Shipped', width: 12, format: dateFormat },
      { header: 'Document', width: 24 },
      { header: 'Number', width: 16 },
      { header: 'Waste description', width: 34 },
      { header: 'Quantity, L', width: 12, format: '#,##0' },
      { header: 'Signed copy back', width: 14, format: dateFormat },
    ],
    pack.shipments.map((s) => [
      day(s.shippedOn),
      s.documentKind,
      s.documentNumber,
      s.wasteDescription,
      s.quantityLitres,
      day(s.signedCopyReceivedOn),
    ]),
  );
  sheet(
    workbook,
    'Follow-ups',
    [
      { header: 'Follow-up', width: 60 },
      { header: 'Due (site time)', width: 18, format: timeFormat },
      { header: 'Status', width: 10 },
      { header: 'Closed (site time)', width: 18, format: timeFormat },
      { header: 'How it closed', width: 50 },
    ],
    pack.followUps.map((f) => [f.title, siteTime(f.dueAt), f.status, siteTime(f.closedAt), f.closingNote ?? '']),
  );
  await workbook.commit();
  await finished;
  return Buffer.concat(chunks);
}
