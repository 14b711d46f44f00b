import type { DataSource, EntityManager } from 'typeorm';
import type { PeriodSummary, SignatureInputs, SignOffItem } from '../../contracts/periods.js';
import { labFindingCodes } from '../../domain/lab-checks.js';
import { sncWindows } from '../../domain/period/significant-noncompliance.js';
import { findingSourceIds } from './finding-ids.js';
import { TrailChainHead } from '../../kernel/trail/trail-chain-head.entity.js';
import type { PeriodRecord } from './period-input.repository.js';
import { PeriodAmendment } from './period-amendment.entity.js';
import { PeriodSignature } from './period-signature.entity.js';
import { ReportingPeriod } from './reporting-period.entity.js';

type Db = DataSource | EntityManager;

/** The first day a period's summary reads: the start of its earliest six-month window. */
const firstDayRead = (period: PeriodRecord) =>
  [
    period.startsOn,
    ...sncWindows({ start: period.startsOn, end: period.endsOn }, period.settings.sncWindow).map((w) => w.start),
  ].sort()[0]!;

/**
 * What signing must not be blind to: results of the period carrying a lab finding, missed
 * monitoring, and violation follow-ups still open at the site.
 */
export async function signOffItems(db: Db, period: PeriodRecord, summary: Pick<PeriodSummary, 'rows'>): Promise<SignOffItem[]> {
  // Raw SQL: one pass over the period's results with their samples' flags.
  const findings: Array<{ id: string; point: string; parameter: string; day: string; codes: string[] }> = await db.query(
    `SELECT r.id, d.code AS point, p.name AS parameter, s.collected_on::text AS day,
            array(SELECT DISTINCT c FROM unnest(r.flag_codes || array(SELECT f->>'code' FROM jsonb_array_elements(s.flags) f)) c
                   WHERE c = ANY($4::text[]) ORDER BY c) AS codes
       FROM lab_result r JOIN lab_sample s ON s.id = r.sample_id JOIN discharge_point d ON d.id = s.discharge_point_id
       JOIN parameter p ON p.id = r.parameter_id
      WHERE d.site_id = $1 AND s.collected_on BETWEEN $2 AND $3
        AND (r.flag_codes && $4::text[] OR EXISTS (SELECT 1 FROM jsonb_array_elements(s.flags) f WHERE f->>'code' = ANY($4::text[])))
      ORDER BY s.collected_on, d.code, p.name`,
    [period.siteId, period.startsOn, period.endsOn, labFindingCodes],
  );
  const followUps: Array<{ id: string; title: string }> = await db.query(
    `SELECT id, title FROM follow_up WHERE site_id = $1 AND status = 'open' AND source_entity IN ('exceedance', 'missed-monitoring')
        AND source_id = ANY($2::uuid[])
      ORDER BY due_at`,
    [period.siteId, findingSourceIds(summary)],
  );
  return [
    ...findings.map((f): SignOffItem => ({
      kind: 'lab-finding',
      id: f.id,
      text: `${f.parameter} at ${f.point}, ${f.day}: ${f.codes.join(', ')}`,
    })),
    ...summary.rows.flatMap((row) =>
      row.missedMonitoring.map((missed): SignOffItem => ({
        kind: 'missed-sample',
        id: `${row.limitId}|${missed.unit}`,
        text: `${row.parameter} at ${row.pointCode}, ${missed.unit}: ${missed.taken} of ${missed.required} samples`,
      })),
    ),
    ...followUps.map((f): SignOffItem => ({ kind: 'open-follow-up', id: f.id, text: f.title })),
  ];
}

/**
 * The content hash of every input the period's summary was compiled from (SHA-256 of each
 * row's JSON as PostgreSQL writes it): results, their certificates, flow readings, the limit
 * versions and the permit's settings.
 */
export async function inputHashes(manager: EntityManager, period: PeriodRecord): Promise<SignatureInputs> {
  const hash = (alias: string) => `encode(sha256(convert_to(to_jsonb(${alias})::text, 'UTF8')), 'hex')`;
  const from = firstDayRead(period);
  const pairs = (rows: Array<{ id: string; sha: string }>): Array<[string, string]> => rows.map((row) => [row.id, row.sha]);
  const points = `SELECT DISTINCT discharge_point_id FROM permit_limit WHERE permit_id = $1`;
  const results = await manager.query(
    `SELECT r.id, ${hash('r')} AS sha FROM lab_result r JOIN lab_sample s ON s.id = r.sample_id
      WHERE s.discharge_point_id IN (${points}) AND s.collected_on BETWEEN $2 AND $3 ORDER BY r.id`,
    [period.permitId, from, period.endsOn],
  );
  const certificates = await manager.query(
    `SELECT c.id, ${hash('c')} AS sha FROM lab_certificate c
      WHERE c.id IN (SELECT s.certificate_id FROM lab_sample s WHERE s.discharge_point_id IN (${points}) AND s.collected_on BETWEEN $2 AND $3)
      ORDER BY c.id`,
    [period.permitId, from, period.endsOn],
  );
  const flows = await manager.query(
    `SELECT f.id, ${hash('f')} AS sha FROM flow_reading f WHERE f.discharge_point_id IN (${points}) AND f.day BETWEEN $2 AND $3 ORDER BY f.id`,
    [period.permitId, from, period.endsOn],
  );
  const limits = await manager.query(
    `SELECT l.id, ${hash('l')} AS sha FROM permit_limit l
      WHERE l.permit_id = $1 AND l.applies_from <= $3 AND (l.applies_to IS NULL OR l.applies_to >= $2) ORDER BY l.id`,
    [period.permitId, from, period.endsOn],
  );
  // The settings version the period used, with the permit's kind.
  const [settings] = await manager.query(
    `SELECT encode(sha256(convert_to((to_jsonb(ps) || jsonb_build_object('kind', p.kind))::text, 'UTF8')), 'hex') AS sha
       FROM permit p CROSS JOIN LATERAL permit_settings_on(p.id, $2) ps WHERE p.id = $1`,
    [period.permitId, period.startsOn],
  );
  return {
    results: pairs(results),
    certificates: pairs(certificates),
    flows: pairs(flows),
    limitVersions: pairs(limits),
    permitSettings: settings.sha,
  };
}

export async function trailHead(manager: EntityManager): Promise<{ seq: string; hash: string }> {
  const head = await manager.findOneByOrFail(TrailChainHead, { onlyRow: true });
  return { seq: String(head.seq), hash: head.hash };
}

/** The period row, locked for the rest of the transaction: two signatures cannot race. */
export const lockPeriodRow = (manager: EntityManager, periodId: string) =>
  manager.getRepository(ReportingPeriod).findOneOrFail({ where: { id: periodId }, lock: { mode: 'pessimistic_write' } });

export const signaturesOf = (db: Db, periodId: string) =>
  db.getRepository(PeriodSignature).find({ where: { periodId }, order: { revision: 'ASC' }, relations: { amendment: true } });

export const signatureOf = (db: Db, periodId: string, revision: number) =>
  db.getRepository(PeriodSignature).findOne({ where: { periodId, revision }, relations: { amendment: true } });

export const openAmendmentOf = (db: Db, periodId: string, amendsRevision: number) =>
  db.getRepository(PeriodAmendment).findOneBy({ periodId, amendsRevision });

export async function saveSignature(manager: EntityManager, signature: Omit<PeriodSignature, 'id'>): Promise<void> {
  await manager.save(PeriodSignature, manager.create(PeriodSignature, signature));
  await manager.update(
    ReportingPeriod,
    { id: signature.periodId },
    { status: 'signed', revision: signature.revision, summary: signature.summary, compiledAt: new Date(signature.summary.compiledAt) },
  );
}

export async function saveAmendment(manager: EntityManager, amendment: Omit<PeriodAmendment, 'id' | 'openedAt'>): Promise<PeriodAmendment> {
  const saved = await manager.save(PeriodAmendment, manager.create(PeriodAmendment, amendment));
  await manager.update(ReportingPeriod, { id: amendment.periodId }, { status: 'amended' });
  return saved;
}

/** The period's last compile as stored (what the coordinator reviewed before signing). */
export async function storedCompile(db: Db, periodId: string): Promise<{ summary: PeriodSummary | null; compiledAt: Date | null }> {
  const row = await db.getRepository(ReportingPeriod).findOne({ where: { id: periodId }, select: { summary: true, compiledAt: true } });
  return { summary: (row?.summary as PeriodSummary | null) ?? null, compiledAt: row?.compiledAt ?? null };
}

/** The pack (PDF or workbook) kept with a signed revision; revisions signed before workbooks were kept have none. */
export async function storedPack(db: Db, periodId: string, revision: number, format: 'pdf' | 'xlsx'): Promise<Buffer | null> {
  const column = format === 'pdf' ? 'packPdf' : 'packXlsx';
  const row = await db
    .getRepository(PeriodSignature)
    .createQueryBuilder('s')
    .addSelect(`s.${column}`)
    .where('s.periodId = :periodId AND s.revision = :revision', { periodId, revision })
    .getOne();
  return row?.[column] ?? null;
}
