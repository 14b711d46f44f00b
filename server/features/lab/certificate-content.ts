import { DateTime } from 'luxon';
import type { EntityManager } from 'typeorm';
import type { UpdateLabCertificateRequest } from '../../contracts/lab.js';
import { invalid } from '../../errors/app-error.js';

type Content = Pick<UpdateLabCertificateRequest, 'qcBatches' | 'samples'>;

/** A site-local 'YYYY-MM-DDTHH:mm' as an instant, using the site's IANA zone. */
export function localToInstant(local: string, timeZone: string): Date {
  return DateTime.fromISO(local, { zone: timeZone }).toJSDate();
}

/**
 * Writes a certificate's QC batches, samples and results (replacing any there were). Checks
 * what only the database can tell: points belong to the site, parameters are known there, QC
 * batch codes exist. Any problem throws before the caller's transaction commits.
 */
export async function writeCertificateContent(
  manager: EntityManager,
  certificateId: string,
  site: { id: string; timeZone: string },
  content: Content,
  { replacing = true }: { replacing?: boolean } = {},
): Promise<void> {
  const pointIds = [...new Set(content.samples.map((sample) => sample.dischargePointId))];
  const parameterIds = [...new Set(content.samples.flatMap((sample) => sample.results.map((result) => result.parameterId)))];
  const points = new Set<string>(
    (await manager.query('SELECT id FROM discharge_point WHERE site_id = $1 AND id = ANY($2::uuid[])', [site.id, pointIds])).map(
      (row: { id: string }) => row.id,
    ),
  );
  const parameters = new Set<string>(
    (
      await manager.query('SELECT id FROM parameter WHERE (site_id IS NULL OR site_id = $1) AND id = ANY($2::uuid[])', [
        site.id,
        parameterIds,
      ])
    ).map((row: { id: string }) => row.id),
  );
  const batchCodes = new Set(content.qcBatches.map((batch) => batch.code));
  const fields: Record<string, string> = {};
  if (batchCodes.size !== content.qcBatches.length) fields.qcBatches = 'Two QC batches have the same code';
  content.samples.forEach((sample, s) => {
    if (!points.has(sample.dischargePointId)) fields[`samples.${s}.dischargePointId`] = 'Not a discharge point of this site';
    sample.results.forEach((result, r) => {
      if (!parameters.has(result.parameterId)) fields[`samples.${s}.results.${r}.parameterId`] = 'Not a parameter of this site';
      if (result.qcBatchCode && !batchCodes.has(result.qcBatchCode)) {
        fields[`samples.${s}.results.${r}.qcBatchCode`] = 'No QC batch with this code on the certificate';
      }
    });
  });
  if (Object.keys(fields).length > 0) throw invalid(fields);

  if (replacing) {
    await manager.query('DELETE FROM lab_sample WHERE certificate_id = $1', [certificateId]);
    await manager.query('DELETE FROM qc_batch WHERE certificate_id = $1', [certificateId]);
  }
  const batchIds = new Map<string, string>();
  for (const batch of content.qcBatches) {
    const [row] = await manager.query(
      `INSERT INTO qc_batch (certificate_id, code, fraction, opr_recovery_pct, ms_recovery_pct, msd_recovery_pct, rpd_pct,
         method_blank, spike_true, spike_background, ms_found, msd_found)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12) RETURNING id`,
      [
        certificateId,
        batch.code,
        batch.fraction,
        batch.oprRecoveryPct,
        batch.msRecoveryPct,
        batch.msdRecoveryPct,
        batch.rpdPct,
        batch.methodBlank,
        batch.spikeTrue,
        batch.spikeBackground,
        batch.msFound,
        batch.msdFound,
      ],
    );
    batchIds.set(batch.code, row.id);
  }
  for (const sample of content.samples) {
    const [row] = await manager.query(
      `INSERT INTO lab_sample (certificate_id, discharge_point_id, collected_at, collected_on, collected_by, sample_type,
         preservation_confirmed, temperature_on_receipt_c, chain_of_custody_number)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9) RETURNING id`,
      [
        certificateId,
        sample.dischargePointId,
        localToInstant(sample.collectedAt, site.timeZone),
        sample.collectedAt.slice(0, 10),
        sample.collectedBy,
        sample.sampleType,
        sample.preservationConfirmed,
        sample.temperatureOnReceiptC,
        sample.chainOfCustodyNumber,
      ],
    );
    // A sample's results in one statement: imports write thousands of them.
    const results = sample.results;
    await manager.query(
      `INSERT INTO lab_result (sample_id, parameter_id, method, qualifier, value_reported, value, mdl, ml, unit, analysed_at, qc_batch_id)
       SELECT $1, * FROM unnest($2::uuid[], $3::text[], $4::text[], $5::text[], $6::numeric[], $7::numeric[], $8::numeric[], $9::text[],
         $10::timestamptz[], $11::uuid[])`,
      [
        row.id,
        results.map((r) => r.parameterId),
        results.map((r) => r.method),
        results.map((r) => r.qualifier),
        results.map((r) => r.value),
        results.map((r) => Number(r.value)),
        results.map((r) => r.mdl),
        results.map((r) => r.ml),
        results.map((r) => r.unit),
        results.map((r) => (r.analysedAt ? localToInstant(r.analysedAt, site.timeZone) : null)),
        results.map((r) => (r.qcBatchCode ? (batchIds.get(r.qcBatchCode) ?? null) : null)),
      ],
    );
  }
}
