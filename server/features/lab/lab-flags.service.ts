import type { EntityManager } from 'typeorm';
import type { Flag } from '../../contracts/flags.js';
import { checkQcBatch, checkResult, checkSample, type LimitFacts, type SampleFacts } from '../../domain/lab-checks.js';

interface LimitRow {
  parameter_id: string;
  statistic: LimitFacts['statistic'];
  value: string;
  unit: string;
  sample_type: LimitFacts['sampleType'];
  effective_from: string;
  effective_to: string | null;
}

interface ResultFactsRow {
  id: string;
  sample_id: string;
  parameter_id: string;
  parameter_name: string;
  fraction: 'HEM' | 'SGT-HEM' | null;
  method: string;
  qualifier: '<' | null;
  value_reported: string;
  unit: string;
  ml: string | null;
  analysed_at: Date | null;
  qc_batch_id: string | null;
}

/**
 * Runs every lab check over one certificate and stores the flags on its QC batches, samples,
 * results and the certificate itself. Called inside the transaction that wrote the data, and
 * again when a limit at one of its points changes.
 */
export async function computeCertificateFlags(
  manager: EntityManager,
  certificateId: string,
  { now = new Date(), limits = limitsInForce(manager) }: { now?: Date; limits?: LimitsInForce } = {},
): Promise<void> {
  const [certificate] = await manager.query(
    `SELECT c.id, s.time_zone FROM lab_certificate c JOIN site s ON s.id = c.site_id WHERE c.id = $1`,
    [certificateId],
  );
  const timeZone: string = certificate.time_zone;

  const qcFlags = new Map<string, Flag[]>();
  const batches = await manager.query('SELECT * FROM qc_batch WHERE certificate_id = $1', [certificateId]);
  for (const batch of batches) {
    const n = (value: string | null) => (value === null ? null : Number(value));
    const hasSpike = batch.spike_true !== null && batch.ms_found !== null && batch.msd_found !== null;
    const flags = checkQcBatch({
      fraction: batch.fraction,
      oprRecoveryPct: n(batch.opr_recovery_pct),
      msRecoveryPct: n(batch.ms_recovery_pct),
      msdRecoveryPct: n(batch.msd_recovery_pct),
      rpdPct: n(batch.rpd_pct),
      methodBlank: n(batch.method_blank),
      spike: hasSpike
        ? {
            spiked: Number(batch.spike_true),
            background: Number(batch.spike_background ?? 0),
            msFound: Number(batch.ms_found),
            msdFound: Number(batch.msd_found),
          }
        : null,
    });
    qcFlags.set(batch.id, flags);
    // Only what changed is written: a recheck leaves the rows of a signed period untouched (and allowed).
    await manager.query('UPDATE qc_batch SET flags = $2 WHERE id = $1 AND flags IS DISTINCT FROM $2::jsonb', [
      batch.id,
      JSON.stringify(flags),
    ]);
  }

  const samples = await manager.query('SELECT * FROM lab_sample WHERE certificate_id = $1', [certificateId]);
  const results: ResultFactsRow[] = await manager.query(
    `SELECT r.*, p.name AS parameter_name, p.fraction FROM lab_result r
       JOIN lab_sample s ON s.id = r.sample_id JOIN parameter p ON p.id = r.parameter_id
      WHERE s.certificate_id = $1`,
    [certificateId],
  );
  const all: Flag[] = [...qcFlags.values()].flat();
  const sampleUpdates: Array<[string, string]> = [];
  const resultUpdates: Array<[string, string, string]> = [];
  for (const sample of samples) {
    const facts: SampleFacts = {
      collectedAt: sample.collected_at,
      sampleType: sample.sample_type,
      preservationConfirmed: sample.preservation_confirmed,
      temperatureOnReceiptC: sample.temperature_on_receipt_c === null ? null : Number(sample.temperature_on_receipt_c),
    };
    const sampleFlags = checkSample(facts, now);
    sampleUpdates.push([sample.id, JSON.stringify(sampleFlags)]);
    all.push(...sampleFlags);

    const limitsByParameter = await limits(sample.discharge_point_id, sample.collected_on);
    for (const result of results.filter((row) => row.sample_id === sample.id)) {
      const flags = [
        ...checkResult(
          {
            parameterName: result.parameter_name,
            fraction: result.fraction,
            method: result.method,
            qualifier: result.qualifier,
            valueReported: result.value_reported,
            unit: result.unit,
            minimumLevel: result.ml === null ? null : Number(result.ml),
            analysedAt: result.analysed_at,
          },
          facts,
          limitsByParameter.get(result.parameter_id) ?? [],
          timeZone,
        ),
        ...(result.qc_batch_id ? (qcFlags.get(result.qc_batch_id) ?? []) : []),
      ];
      resultUpdates.push([result.id, JSON.stringify(flags), [...new Set(flags.map((flag) => flag.code))].join(',')]);
      all.push(...flags);
    }
  }
  // One statement each for samples and results, however many a certificate has.
  await manager.query(
    `UPDATE lab_sample s SET flags = v.flags::jsonb FROM unnest($1::uuid[], $2::text[]) AS v(id, flags)
      WHERE s.id = v.id AND s.flags IS DISTINCT FROM v.flags::jsonb`,
    [sampleUpdates.map((u) => u[0]), sampleUpdates.map((u) => u[1])],
  );
  await manager.query(
    `UPDATE lab_result r SET flags = v.flags::jsonb, flag_codes = CASE WHEN v.codes = '' THEN '{}' ELSE string_to_array(v.codes, ',') END
       FROM unnest($1::uuid[], $2::text[], $3::text[]) AS v(id, flags, codes) WHERE r.id = v.id AND r.flags IS DISTINCT FROM v.flags::jsonb`,
    [resultUpdates.map((u) => u[0]), resultUpdates.map((u) => u[1]), resultUpdates.map((u) => u[2])],
  );
  await manager.query('UPDATE lab_certificate SET flags = $2 WHERE id = $1 AND flags IS DISTINCT FROM $2::jsonb', [
    certificateId,
    JSON.stringify(summarise(all)),
  ]);
}

/** One flag per code for the certificate, the most severe first, with how often it occurs. */
function summarise(flags: Flag[]): Flag[] {
  const byCode = new Map<string, { flag: Flag; count: number }>();
  for (const flag of flags) {
    const seen = byCode.get(flag.code);
    if (seen) seen.count += 1;
    else byCode.set(flag.code, { flag, count: 1 });
  }
  const order = { error: 0, warning: 1, info: 2 };
  return [...byCode.values()]
    .sort((a, b) => order[a.flag.severity] - order[b.flag.severity])
    .map(({ flag, count }) => (count > 1 ? { ...flag, message: `${flag.message} (${count}×)` } : flag));
}

/** The limits of permits in force at a point on a local day, by parameter. */
export type LimitsInForce = (pointId: string, day: string) => Promise<Map<string, LimitFacts[]>>;

/**
 * Reads each point's limits once, with their permits' effective dates, and answers every day
 * from memory: an import or a recheck asks for the same few points thousands of times.
 */
export function limitsInForce(manager: EntityManager): LimitsInForce {
  const byPoint = new Map<string, Promise<Array<LimitFacts & { parameterId: string; from: string; to: string | null }>>>();
  return async (pointId, day) => {
    let limits = byPoint.get(pointId);
    if (!limits) {
      limits = manager
        .query(
          // A limit version applies while both it and its permit are in force.
          `SELECT l.parameter_id, l.statistic, l.value, l.unit, l.sample_type,
                  greatest(p.effective_from, l.applies_from)::text AS effective_from,
                  (CASE WHEN p.effective_to IS NULL THEN l.applies_to WHEN l.applies_to IS NULL THEN p.effective_to
                        ELSE least(p.effective_to, l.applies_to) END)::text AS effective_to
             FROM permit_limit l JOIN permit p ON p.id = l.permit_id WHERE l.discharge_point_id = $1`,
          [pointId],
        )
        .then((rows: LimitRow[]) =>
          rows.map((row) => ({
            parameterId: row.parameter_id,
            statistic: row.statistic,
            value: Number(row.value),
            unit: row.unit,
            sampleType: row.sample_type,
            from: row.effective_from,
            to: row.effective_to,
          })),
        );
      byPoint.set(pointId, limits);
    }
    const map = new Map<string, LimitFacts[]>();
    for (const { parameterId, from, to, ...limit } of await limits) {
      if (from > day || (to !== null && to < day)) continue;
      map.set(parameterId, [...(map.get(parameterId) ?? []), limit]);
    }
    return map;
  };
}

/** After a limit changes, the flags of every certificate with a sample at that point. */
export async function recheckResultsAtPoint(manager: EntityManager, pointId: string): Promise<void> {
  const certificates = await manager.query('SELECT DISTINCT certificate_id FROM lab_sample WHERE discharge_point_id = $1', [pointId]);
  const limits = limitsInForce(manager);
  for (const { certificate_id } of certificates) await computeCertificateFlags(manager, certificate_id, { limits });
}
