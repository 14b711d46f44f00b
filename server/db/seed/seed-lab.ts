import { DateTime } from 'luxon';
import type { DataSource, EntityManager } from 'typeorm';
import type { CurrentUser } from '../../auth/current-user.js';
import type { CreateLabCertificateRequest } from '../../contracts/lab.js';
import { LabCertificatesService } from '../../features/lab/lab-certificates.service.js';
import { demoCertificatePdf } from './demo-certificate-pdf.js';

export const demoLab = { name: 'Brackenridge Analytical Services', accreditation: 'ACC-4471-D (demo)' };

/**
 * What goes wrong at each sampling event, by site and event number, so every lab flag shows
 * on first start. Everything else is an ordinary result.
 */
interface Twist {
  hem?: string;
  ph?: string;
  analysedAfterDays?: number;
  temperature?: number;
  sampleType?: 'composite';
  preservation?: false;
  opr?: number;
  spike?: { spikeTrue: number; spikeBackground: number; msFound: number; msdFound: number };
}
const twists: Record<'north' | 'east', Record<number, Twist>> = {
  north: {
    3: { hem: '5.0', ph: '7.4' },
    5: { hem: '126' },
    8: { opr: 76 },
    11: { analysedAfterDays: 31 },
    14: { sampleType: 'composite' },
    // January–June of the second year: 7 of 11 results at or above 1.4 × the 100 mg/L daily
    // maximum (technical review criteria met), fewer than 66 % over it (not chronic).
    16: { hem: '146' },
    17: { hem: '150' },
    18: { hem: '145' },
    19: { hem: '152' },
    20: { hem: '141' },
    21: { hem: '23.47' },
    22: { hem: '148' },
    23: { hem: '143' },
    24: { hem: '5.0' },
    26: { hem: '58.2' },
    27: { hem: '61.0' },
  },
  east: {
    4: { temperature: 8.2 },
    6: { preservation: false },
    9: { hem: '112' },
    10: { spike: { spikeTrue: 40, spikeBackground: 2, msFound: 30, msdFound: 41 } },
    13: { hem: '3.8' },
    20: { ph: '5.2' },
  },
};
const nonDetects: Record<'north' | 'east', number[]> = { north: [3, 24], east: [15, 16] };
/** The demo's missed sample: this event at the north site never happened. */
const missedEvent = { site: 'north', event: 15 } as const;

function ordinaryHem(event: number, salt: number): string {
  const value = 9 + ((event * 37 + salt * 11) % 290) / 10;
  return value >= 10 ? value.toFixed(1) : value.toFixed(1);
}

export async function seedLab(
  dataSource: DataSource,
  manager: EntityManager,
  sites: Array<{ key: 'north' | 'east'; id: string; name: string; timeZone: string; outfall: string }>,
  coordinator: CurrentUser,
  today = DateTime.now(),
): Promise<void> {
  const service = new LabCertificatesService(dataSource);
  const parameterId = async (code: string) =>
    (await manager.query('SELECT id FROM parameter WHERE site_id IS NULL AND code = $1', [code]))[0].id as string;
  const hem = await parameterId('oil-grease-hem');
  const ph = await parameterId('ph');

  for (const [salt, site] of sites.entries()) {
    const [outfall] = await manager.query('SELECT id, code FROM discharge_point WHERE site_id = $1 AND code = $2', [site.id, site.outfall]);
    const start = today.setZone(site.timeZone).startOf('month').minus({ months: 17 });
    let event = 0;
    for (let month = 0; month < 18; month++) {
      for (const day of [6, 20]) {
        const collected = start.plus({ months: month }).set({ day, hour: 9, minute: 30 });
        const analysed = collected.plus({ days: 2 }).set({ hour: 10, minute: 0 });
        event += 1;
        if (analysed > today.setZone(site.timeZone)) continue;
        if (site.key === missedEvent.site && event === missedEvent.event) continue;
        const twist = twists[site.key][event] ?? {};
        const reportNumber = `BAS-${collected.toFormat('yyMMdd')}-${site.key === 'north' ? 'T' : 'O'}${String(event).padStart(2, '0')}`;
        const exists = await manager.query('SELECT 1 FROM lab_certificate WHERE lab_name = $1 AND report_number = $2', [
          demoLab.name,
          reportNumber,
        ]);
        if (exists.length > 0) continue;

        const nonDetect = nonDetects[site.key].includes(event);
        const hemValue = twist.hem ?? ordinaryHem(event, salt);
        const phValue = twist.ph ?? (6.8 + ((event * 13 + salt) % 16) / 10).toFixed(1);
        const analysedAt = collected.plus({ days: twist.analysedAfterDays ?? 2 }).set({ hour: 10, minute: 0 });
        const local = (time: DateTime) => time.toFormat("yyyy-MM-dd'T'HH:mm");
        const qcCode = `QC-${reportNumber}`;
        const request: CreateLabCertificateRequest = {
          siteId: site.id,
          labName: demoLab.name,
          labAccreditationNumber: demoLab.accreditation,
          reportNumber,
          receivedOn: collected.plus({ days: 1 }).toISODate()!,
          receivedTime: '14:30',
          qcBatches: [
            {
              code: qcCode,
              fraction: 'HEM',
              oprRecoveryPct: twist.opr ?? 96,
              methodBlank: 1.1,
              msRecoveryPct: twist.spike ? null : 92,
              msdRecoveryPct: twist.spike ? null : 95,
              rpdPct: twist.spike ? null : 3.2,
              spikeTrue: twist.spike?.spikeTrue ?? null,
              spikeBackground: twist.spike?.spikeBackground ?? null,
              msFound: twist.spike?.msFound ?? null,
              msdFound: twist.spike?.msdFound ?? null,
            },
          ],
          samples: [
            {
              dischargePointId: outfall.id,
              collectedAt: local(collected),
              collectedBy: site.key === 'north' ? 'Luis Okafor' : 'Jo Brandt',
              sampleType: twist.sampleType ?? 'grab',
              preservationConfirmed: twist.preservation ?? true,
              temperatureOnReceiptC: twist.temperature ?? 3.8,
              chainOfCustodyNumber: `COC-${reportNumber}`,
              results: [
                {
                  parameterId: hem,
                  method: '1664B',
                  qualifier: nonDetect ? '<' : null,
                  value: nonDetect ? '5.0' : hemValue,
                  mdl: 1.4,
                  ml: 5.0,
                  unit: 'mg/L',
                  analysedAt: local(analysedAt),
                  qcBatchCode: qcCode,
                },
                {
                  parameterId: ph,
                  method: 'SM 4500-H+ B',
                  qualifier: null,
                  value: phValue,
                  mdl: null,
                  ml: null,
                  unit: 'SU',
                  analysedAt: local(collected.plus({ minutes: 10 })),
                  qcBatchCode: null,
                },
              ],
            },
          ],
        };
        const pdf = await demoCertificatePdf({
          labName: demoLab.name,
          accreditation: demoLab.accreditation,
          reportNumber,
          receivedOn: request.receivedOn,
          siteName: site.name,
          rows: [
            {
              point: outfall.code,
              collected: local(collected).replace('T', ' '),
              parameter: 'Oil and grease (HEM)',
              method: 'EPA 1664B',
              result: nonDetect ? '<5.0' : hemValue,
              unit: 'mg/L',
              analysed: local(analysedAt).replace('T', ' '),
            },
            {
              point: outfall.code,
              collected: local(collected).replace('T', ' '),
              parameter: 'pH',
              method: 'SM 4500-H+ B',
              result: phValue,
              unit: 'SU',
              analysed: local(collected.plus({ minutes: 10 })).replace('T', ' '),
            },
          ],
        });
        const id = await service.insertCertificate(manager, coordinator, request, {
          upload: { originalname: `${reportNumber}.pdf`, buffer: pdf, size: pdf.length },
          mediaType: 'application/pdf',
        });
        // Entered the morning it came in: that is when the coordinator became aware of its results.
        await manager.query('UPDATE lab_certificate SET created_at = $2 WHERE id = $1', [
          id,
          collected.plus({ days: 1 }).set({ hour: 10, minute: 0 }).toJSDate(),
        ]);
      }
    }
  }
}
