import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces.js';
import type { NoticeView } from '../server/contracts/notices.js';
import { renderPdf } from './pdf.js';

const statisticWords: Record<string, string> = {
  'daily-maximum': 'daily maximum',
  'monthly-average': 'monthly average',
  'instantaneous-minimum': 'instantaneous minimum',
  'instantaneous-maximum': 'instantaneous maximum',
};

/** The notice of a violation as sent to the control authority: the facts, then the site's account. */
export async function authorityNoticePdf(notice: NoticeView, sent: { at: string; byName: string }): Promise<Buffer> {
  const f = notice.facts;
  const row = (label: string, value: string): Content[] => [{ text: label, bold: true }, { text: value }];
  const content: Content[] = [
    { text: 'Notice of a permit limit violation', fontSize: 16, bold: true },
    { text: `${f.site} · permit ${f.permitNumber} · to ${f.authority}`, color: '#444444', margin: [0, 0, 0, 10] },
    {
      table: {
        widths: [140, '*'],
        body: [
          row('Company', f.company),
          row('Site', f.siteAddress ? `${f.site}, ${f.siteAddress}` : f.site),
          row('Permit', f.permitNumber),
          row('Discharge point', f.pointCode),
          row('Parameter', f.parameter),
          row('Limit', `${f.limit} ${f.unit} (${statisticWords[f.statistic] ?? f.statistic})`),
          row('Result', `${f.value} on ${f.date}`),
          row('Sampled (site time)', f.sampledAt.join('; ') || 'not recorded'),
          row('Became aware (site time)', f.awareAt ? `${f.awareAt}, from ${f.awareSource}` : 'not recorded'),
          row('Notice due (site time)', f.dueAt),
        ],
      },
      layout: 'lightHorizontalLines',
      margin: [0, 0, 0, 12],
    },
    { text: 'Cause', bold: true, fontSize: 11 },
    { text: notice.cause, margin: [0, 2, 0, 10] },
    { text: 'Corrective action', bold: true, fontSize: 11 },
    { text: notice.correctiveAction, margin: [0, 2, 0, 10] },
    { text: 'Repeat sample', bold: true, fontSize: 11 },
    { text: notice.repeatSampleOn ? `Taken or planned on ${notice.repeatSampleOn}.` : 'Date not yet set.', margin: [0, 2, 0, 10] },
    { text: `Sent ${sent.at} (site time) by ${sent.byName} to ${notice.to}.`, margin: [0, 6, 0, 10] },
    {
      text: 'Prepared with Decant, a record-keeping aid. The permit and the control authority say how and when notice is to be given; this notice does not replace any form or call they require.',
      fontSize: 8,
      color: '#444444',
    },
  ];
  const definition: TDocumentDefinitions = {
    pageSize: 'LETTER',
    pageMargins: [48, 54, 48, 54],
    info: { title: `Notice of a violation, permit ${f.permitNumber}, ${f.date}`, author: f.company, creator: 'Decant', producer: 'Decant' },
    content,
    defaultStyle: { fontSize: 10, lineHeight: 1.2 },
  };
  return renderPdf(definition);
}
