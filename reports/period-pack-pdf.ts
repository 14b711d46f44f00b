import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces.js';
import type { PeriodPackInput } from '../server/contracts/period-pack.js';
import type { LimitRow } from '../server/contracts/periods.js';
import type PDFKit from 'pdfkit';
import { fontFile, renderPdf } from './pdf.js';
import { drawRecordPages, recordPagesNeeded, type RecordPageFrame } from './record-pages.js';

const statisticWords: Record<LimitRow['statistic'], string> = {
  'daily-maximum': 'Daily maximum',
  'monthly-average': 'Monthly average',
  'instantaneous-minimum': 'Instantaneous minimum',
  'instantaneous-maximum': 'Instantaneous maximum',
};
const policyWords = { zero: 'zero', mdl: 'the MDL', ml: 'the ML', 'half-mdl': 'half the MDL' };
const documentWords: Record<string, string> = {
  'hazardous-waste-manifest': 'Hazardous waste manifest',
  'used-oil-bill-of-lading': 'Used oil bill of lading',
  'non-hazardous-manifest': 'Non-hazardous manifest',
};
/** A finding's code in words ("holding-time" → "holding time"). */
const words = (code: string) => code.replace(/-/g, ' ');
const kindWords = {
  pretreatment: 'Industrial-user (pretreatment) permit, 40 CFR 403',
  npdes: 'Direct-discharge (NPDES) permit, 40 CFR 122',
};

/** A verdict in words: printed in black and white, colour can carry nothing. */
function verdict(row: LimitRow): string {
  if (row.computedValue === null) return 'No data';
  if (row.exceeded) return row.statistic === 'instantaneous-minimum' ? 'Below the limit' : 'Over the limit';
  return 'Within the limit';
}

const head = (...titles: string[]): TableCell[] => titles.map((text) => ({ text, style: 'th' }));
function table(widths: Array<string | number>, header: TableCell[], rows: TableCell[][], empty: string, fontSize?: number): Content {
  if (rows.length === 0) return { text: empty, style: 'muted', margin: [0, 0, 0, 8] };
  return {
    table: { headerRows: 1, widths, body: [header, ...rows], dontBreakRows: true },
    layout: 'lightHorizontalLines',
    margin: [0, 0, 0, 10],
    ...(fontSize ? { fontSize } : {}),
  };
}
const h2 = (text: string): Content => ({ text, style: 'h2', margin: [0, 10, 0, 4] });
const num = (value: number | null | undefined, digits = 1) => (value === null || value === undefined ? '—' : value.toFixed(digits));

/** Per point and unit: how many days were read, and the average, highest and lowest daily flow. */
function flowSummary(flows: PeriodPackInput['flows']) {
  const groups = new Map<string, { pointCode: string; unit: string; values: number[] }>();
  for (const f of flows) {
    const key = `${f.pointCode}|${f.unit}`;
    const group = groups.get(key) ?? { pointCode: f.pointCode, unit: f.unit, values: [] };
    group.values.push(f.value);
    groups.set(key, group);
  }
  return [...groups.values()].map((g) => ({
    pointCode: g.pointCode,
    unit: g.unit,
    days: g.values.length,
    average: g.values.reduce((a, b) => a + b, 0) / g.values.length,
    highest: Math.max(...g.values),
    lowest: Math.min(...g.values),
  }));
}

/**
 * The period pack as PDF: a pure builder, pack data in, bytes out. For a signed period every
 * input is fixed (the snapshot, the signing time), so the same signature gives the same file.
 */
export function periodPackPdf(pack: PeriodPackInput): Promise<Buffer> {
  const { summary, site, permit } = pack;
  const signature = summary.status === 'signed' ? summary.signature : null;
  const revision = signature
    ? `revision ${signature.revision}`
    : summary.revision > 0
      ? `DRAFT of revision ${summary.revision + 1}`
      : 'DRAFT';
  const periodText = `${summary.period.start} – ${summary.period.end}`;
  const pointName = new Map(pack.points.map((p) => [p.code, p.name]));
  const rowsByPoint = new Map<string, LimitRow[]>();
  for (const row of summary.rows) rowsByPoint.set(row.pointCode, [...(rowsByPoint.get(row.pointCode) ?? []), row]);

  const facility: Content = {
    table: {
      widths: [120, '*'],
      body: [
        ['Company', pack.company],
        ['Site', `${site.name}\n${site.address}`],
        ['Permit', `${permit.number} · ${kindWords[permit.kind]}`],
        ['Control authority', permit.issuingAuthority],
        ['Discharge points', pack.points.map((p) => `${p.code} — ${p.name}`).join('\n') || '—'],
        ['Period', `${periodText} · report due ${summary.period.due}`],
        ['Status', signature ? `Signed, ${revision}` : `${revision}: not signed`],
      ].map(([label, value]): TableCell[] => [{ text: label!, bold: true }, value!]),
    },
    layout: 'noBorders',
    margin: [0, 0, 0, 6],
  };

  const limitTables: Content[] = [...rowsByPoint.entries()].flatMap(([code, rows]) => [
    { text: `${code} — ${pointName.get(code) ?? ''}`, style: 'h3', margin: [0, 6, 0, 2] } as Content,
    table(
      ['*', 78, 62, 58, 46, 68],
      head('Parameter', 'Statistic', 'Limit', 'Value', 'Samples', 'Verdict'),
      rows.map((row) => [
        {
          text: [
            row.parameter,
            row.appliesFrom !== summary.period.start || row.appliesTo !== summary.period.end
              ? { text: `\nversion in force ${row.appliesFrom} – ${row.appliesTo}`, style: 'muted' }
              : '',
          ],
        },
        statisticWords[row.statistic],
        `${row.limitValue} ${row.unit}`,
        row.shownValue === null ? '—' : `${row.shownValue === '<ML' ? '<ML' : row.shownValue} ${row.unit}`,
        `${row.samplesTaken} / ${row.samplesRequired}`,
        { text: verdict(row), bold: row.exceeded },
      ]),
      'No limits at this point.',
    ),
  ]);

  const exceedances = summary.rows.flatMap((row) => row.exceedances.map((e) => ({ row, e })));
  const missed = summary.rows.flatMap((row) => row.missedMonitoring.map((m) => ({ row, m })));
  const timeliness = summary.reportTimeliness;

  const content: Content[] = [
    { text: 'Periodic discharge report', style: 'h1' },
    { text: `${site.name} · permit ${permit.number} · ${periodText}`, style: 'muted', margin: [0, 0, 0, 8] },
    facility,
    h2('Limits and results'),
    ...limitTables,
    h2('Exceedances'),
    table(
      [56, 40, '*', 56, 48, 44],
      head('Date', 'Point', 'Parameter and statistic', 'Value', 'Limit', 'Past by'),
      exceedances.map(({ row, e }) => [
        e.date,
        row.pointCode,
        `${row.parameter}, ${statisticWords[row.statistic].toLowerCase()}`,
        `${e.shownValue} ${row.unit}`,
        `${e.limit} ${row.unit}`,
        `${e.percentOver} %`,
      ]),
      'No exceedance in the period.',
    ),
    table(
      ['*', 70, 60, 150],
      head('Follow-up opened', 'Due', 'Status', 'Closed'),
      pack.followUps.map((f) => [
        f.title,
        f.dueAt,
        f.status,
        f.closedAt ? `${f.closedAt}${f.closingNote ? ` — ${f.closingNote}` : ''}` : 'open',
      ]),
      'No follow-up was opened by this period.',
    ),
    h2('Missed monitoring'),
    table(
      [40, '*', 70, 70],
      head('Point', 'Parameter', 'Unit of time', 'Taken / required'),
      missed.map(({ row, m }) => [row.pointCode, row.parameter, m.unit, `${m.taken} / ${m.required}`]),
      'No missed monitoring.',
    ),
  ];

  if (summary.significantNoncompliance) {
    content.push(
      h2('Significant noncompliance (40 CFR 403.8(f)(2)(viii))'),
      {
        text: 'Chronic: 66 % or more of the measurements in six months exceed a limit. Technical review criteria: 33 % or more are at or above the limit times 1.4 (BOD, TSS, fats, oil and grease) or 1.2 (other pollutants); pH is excluded.',
        style: 'muted',
        margin: [0, 0, 0, 4],
      },
      table(
        ['*', 90, 50, 50, 60, 70],
        head('Parameter', 'Six months', 'Measured', 'Over', 'Chronic', 'Technical review'),
        summary.significantNoncompliance.map((v) => [
          v.parameterName,
          `${v.window.start} – ${v.window.end}`,
          String(v.measurements),
          String(v.exceeding),
          v.chronic ? 'Met' : 'Not met',
          v.technicalReview === null ? 'Not applicable' : v.technicalReview ? 'Met' : 'Not met',
        ]),
        'No pollutant limits.',
      ),
    );
  }

  content.push(
    h2('Report timeliness'),
    {
      text: `Due ${timeliness.dueOn}; ${timeliness.submittedOn ? `sent ${timeliness.submittedOn}` : 'not recorded as sent'}${
        timeliness.daysLate > 0 ? `; ${timeliness.daysLate} days late` : ''
      }${timeliness.significantNoncompliance ? `; more than ${timeliness.lateReportDays} days late is significant noncompliance` : ''}.`,
    },
    h2('How the values were computed'),
    {
      ul: [
        'Daily discharge, average monthly and maximum daily values follow the definitions of 40 CFR 122.2: a concentration is the average of the day’s measurements.',
        `Non-detects count as ${policyWords[summary.nonDetectPolicy]} in averages; a statistic over non-detects only is reported as <ML.`,
        'Oil and grease by EPA Method 1664: a result below the minimum level is reported as “<5.0 mg/L” (§12.3.1), figures to its precision (§12.3).',
        `Mass loading: lb/day = MGD × mg/L × ${summary.massLoadingFactor}.`,
        'Each day is judged against the limit version in force on it; rows show a version’s days when it did not cover the whole period.',
      ],
      margin: [0, 0, 0, 6],
    },
    h2('Samples and results'),
    {
      text:
        pack.samples.length === 0
          ? 'No results in the period.'
          : `Every result of the period, sample by sample (${pack.samples.length.toLocaleString('en-US')}), is listed on the last pages of this report.`,
      margin: [0, 0, 0, 6],
    },
    // The certificate index is wide (file name and SHA-256): a landscape page of its own.
    { text: 'Lab certificates', style: 'h2', margin: [0, 0, 0, 4], pageBreak: 'before', pageOrientation: 'landscape' },
    table(
      [76, 110, 100, 56, 100, 200],
      head('Report', 'Lab', 'Sampled', 'Received', 'Analysed', 'File and SHA-256'),
      pack.certificates.map((c) => [
        c.reportNumber,
        c.lab,
        c.sampledFrom === c.sampledTo ? c.sampledFrom : `${c.sampledFrom} – ${c.sampledTo}`,
        c.receivedOn,
        c.analysedFrom ? (c.analysedFrom === c.analysedTo ? c.analysedFrom : `${c.analysedFrom} – ${c.analysedTo}`) : '—',
        c.fileName ? { text: `${c.fileName}\n${c.sha256}`, fontSize: 7 } : 'no file',
      ]),
      'No certificate in the period.',
    ),
    { text: 'Flow', style: 'h2', margin: [0, 0, 0, 4], pageBreak: 'before', pageOrientation: 'portrait' },
    table(
      [60, 70, 70, 70, 70, '*'],
      head('Point', 'Days read', 'Average', 'Highest', 'Lowest', 'Unit'),
      flowSummary(pack.flows).map((f) => [f.pointCode, String(f.days), num(f.average, 0), num(f.highest, 0), num(f.lowest, 0), f.unit]),
      'No flow readings in the period.',
    ),
    h2('Oil collected, shipped and on hand'),
    {
      text: `Collected ${summary.oil.collectedLitres.toFixed(0)} L; shipped ${summary.oil.shippedLitres.toFixed(0)} L; on hand at the end ${
        summary.oil.onHandAtEndLitres === null ? 'not known (before the opening balance)' : `${summary.oil.onHandAtEndLitres.toFixed(0)} L`
      }.`,
      margin: [0, 0, 0, 4],
    },
    table(
      [60, 130, '*', 70, 90],
      head('Shipped', 'Document', 'Number', 'Quantity', 'Signed copy back'),
      pack.shipments.map((s) => [
        s.shippedOn,
        documentWords[s.documentKind] ?? words(s.documentKind),
        s.documentNumber,
        `${s.quantityLitres.toFixed(0)} L`,
        s.signedCopyReceivedOn ?? 'not yet',
      ]),
      'No shipment in the period.',
    ),
    h2('Cautions'),
    { ul: summary.cautions, margin: [0, 0, 0, 6] },
    h2('Certification'),
    { text: pack.statement.section, style: 'muted' },
    { text: pack.statement.text, italics: true, margin: [0, 2, 0, 10] },
    signature
      ? {
          table: {
            widths: [90, '*'],
            body: [
              ['Signed by', signature.signerName],
              ['Title', signature.signerTitle],
              ['Date', signature.signedAt],
              ['Revision', String(signature.revision)],
              ...(signature.amendmentReason ? [['Amended because', signature.amendmentReason]] : []),
              ['Snapshot SHA-256', { text: signature.sha256, fontSize: 7 }],
              ['Trail head at signing', { text: `entry ${signature.trailHead.seq}, ${signature.trailHead.hash}`, fontSize: 7 }],
            ],
          },
          layout: 'lightHorizontalLines',
        }
      : { text: 'Not signed. This is a draft compiled from the records as they were at the time printed.', bold: true },
  );

  const running: RunningText = {
    headerLeft: `${site.name} · permit ${permit.number}`,
    headerRight: `${periodText} · ${revision}`,
    footerLeft: `Generated ${pack.generatedAt} (site time)${signature ? ` · snapshot SHA-256 ${signature.sha256}` : ''}`,
    draft: !signature,
  };
  const frame = recordFrame(running);
  const samplePages = recordPagesNeeded(pack.samples.length, frame);
  let pageCount = 0;
  const definition: TDocumentDefinitions = {
    pageSize: 'LETTER',
    pageOrientation: 'portrait',
    pageMargins: [36, 54, 36, 48],
    info: {
      title: `Periodic discharge report ${permit.number} ${periodText}`,
      author: pack.company,
      creator: 'Decant',
      producer: 'Decant',
      creationDate: new Date(signature?.signedAt ?? summary.compiledAt),
      modDate: new Date(signature?.signedAt ?? summary.compiledAt),
    },
    watermark: signature ? undefined : { text: 'DRAFT', opacity: 0.12, bold: true },
    header: () => ({
      columns: [
        { text: running.headerLeft, bold: true },
        { text: running.headerRight, alignment: 'right' },
      ],
      margin: [36, 24, 36, 0],
      fontSize: 8,
    }),
    footer: (currentPage, pageCount) => ({
      columns: [
        { text: running.footerLeft, fontSize: 6.5 },
        { text: `Page ${currentPage} of ${pageCount + samplePages}`, alignment: 'right', width: 70 },
      ],
      margin: [36, 16, 36, 0],
      fontSize: 8,
    }),
    content,
    styles: {
      h1: { fontSize: 16, bold: true },
      h2: { fontSize: 11.5, bold: true },
      h3: { fontSize: 10, bold: true },
      th: { bold: true, fontSize: 8 },
      muted: { fontSize: 8, color: '#444444' },
    },
    defaultStyle: { fontSize: 8.5, lineHeight: 1.15 },
  };
  // Counted as pdfmake lays out pages, so the record pages continue its numbering.
  const footer = definition.footer as (currentPage: number, pageCount: number) => Content;
  definition.footer = (currentPage, count) => ((pageCount = count), footer(currentPage, count));
  frame.totalPages = () => pageCount + samplePages;
  return renderPdf(definition, (doc) =>
    drawRecordPages(
      doc,
      frame,
      {
        title: 'Samples and results',
        columns: [
          { header: 'Sampled (site time)', width: 80 },
          { header: 'Point', width: 44 },
          { header: 'Parameter', width: 130 },
          { header: 'Result', width: 62 },
          { header: 'MDL', width: 30 },
          { header: 'ML', width: 30 },
          { header: 'Method', width: 56 },
          { header: 'Report, lab', width: 148 },
          { header: 'Findings', width: 140 },
        ],
        rows: pack.samples.map((s) => [
          s.sampledAt,
          s.pointCode,
          s.parameter,
          `${s.result} ${s.unit}`,
          num(s.mdl),
          num(s.ml),
          s.method,
          `${s.reportNumber}, ${s.lab}`,
          s.findings.map(words).join(', ') || '—',
        ]),
        empty: 'No results in the period.',
      },
      pageCount + 1,
    ),
  );
}

/** What every page carries, whoever draws it. */
interface RunningText {
  headerLeft: string;
  headerRight: string;
  footerLeft: string;
  draft: boolean;
}

/** Landscape US-letter pages for the record tables, with the same running header, footer and draft mark. */
function recordFrame(running: RunningText): RecordPageFrame & { totalPages: () => number } {
  const width = 792;
  const height = 612;
  const frame = {
    size: 'LETTER',
    layout: 'landscape' as const,
    width,
    height,
    margins: { top: 54, bottom: 48, left: 36, right: 36 },
    regularFont: fontFile(400),
    boldFont: fontFile(700),
    totalPages: () => 0,
    decorate(doc: PDFKit.PDFDocument, pageNumber: number) {
      if (running.draft) {
        doc.save();
        doc.rotate((-Math.atan2(height, width) * 180) / Math.PI, { origin: [width / 2, height / 2] });
        doc.font(fontFile(700)).fontSize(150).fillColor('black').fillOpacity(0.12);
        doc.text('DRAFT', width / 2 - doc.widthOfString('DRAFT') / 2, height / 2 - 75, { lineBreak: false });
        doc.restore();
      }
      doc.fillColor('black').fillOpacity(1);
      doc.font(fontFile(700)).fontSize(8).text(running.headerLeft, 36, 24, { lineBreak: false });
      doc.font(fontFile(400)).fontSize(8);
      doc.text(running.headerRight, width - 36 - doc.widthOfString(running.headerRight), 24, { lineBreak: false });
      const pageText = `Page ${pageNumber} of ${frame.totalPages()}`;
      doc.text(pageText, width - 36 - doc.widthOfString(pageText), height - 32, { lineBreak: false });
      doc.fontSize(6.5).text(running.footerLeft, 36, height - 32, { lineBreak: false });
    },
  };
  return frame;
}
