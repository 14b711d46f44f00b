import type { DataSource, EntityManager } from 'typeorm';
import type { PeriodPackInput } from '../../contracts/period-pack.js';
import type { PeriodSummary } from '../../contracts/periods.js';
import { labFindingCodes } from '../../domain/lab-checks.js';
import { certificationStatements } from '../../domain/period/certification.js';
import { shownValue } from '../lab/lab.repository.js';
import { findingSourceIds } from '../periods/finding-ids.js';
import type { PeriodRecord } from '../periods/period-input.repository.js';

type Db = DataSource | EntityManager;
const localText = (zoneColumn: string, column: string) => `to_char(${column} AT TIME ZONE ${zoneColumn}, 'YYYY-MM-DD HH24:MI')`;

/**
 * What the pack prints around the summary, read for one period at the permit's points. Raw SQL:
 * each list is one set-based read with the site's local times worked out in the database.
 */
export async function loadPackInput(db: Db, period: PeriodRecord, summary: PeriodSummary, generatedAt: Date): Promise<PeriodPackInput> {
  const [facility] = await db.query(
    `SELECT c.name AS company, s.name AS site, s.address, s.time_zone, p.number, p.kind, p.issuing_authority,
            ${localText('s.time_zone', '$2::timestamptz')} AS generated_at
       FROM permit p JOIN site s ON s.id = p.site_id JOIN company c ON c.id = s.company_id WHERE p.id = $1`,
    [period.permitId, generatedAt],
  );
  const points = await db.query(
    `SELECT d.id, d.code, d.name FROM discharge_point d
      WHERE d.id IN (SELECT DISTINCT discharge_point_id FROM permit_limit WHERE permit_id = $1) ORDER BY d.code`,
    [period.permitId],
  );
  const pointIds = points.map((p: { id: string }) => p.id);
  const samples = await db.query(
    `SELECT ${localText('st.time_zone', 'ls.collected_at')} AS sampled_at, d.code AS point_code, pa.name AS parameter,
            lr.qualifier, lr.value_reported, lr.unit, lr.mdl, lr.ml, lr.method, pa.fraction, c.lab_name, c.report_number,
            array(SELECT DISTINCT x FROM unnest(lr.flag_codes || array(SELECT f->>'code' FROM jsonb_array_elements(ls.flags) f)) x
                   WHERE x = ANY($4::text[]) ORDER BY x) AS findings
       FROM lab_result lr JOIN lab_sample ls ON ls.id = lr.sample_id JOIN lab_certificate c ON c.id = ls.certificate_id
       JOIN discharge_point d ON d.id = ls.discharge_point_id JOIN parameter pa ON pa.id = lr.parameter_id JOIN site st ON st.id = c.site_id
      WHERE ls.discharge_point_id = ANY($1::uuid[]) AND ls.collected_on BETWEEN $2 AND $3
      ORDER BY ls.collected_at, d.code, pa.name`,
    [pointIds, period.startsOn, period.endsOn, labFindingCodes],
  );
  const certificates = await db.query(
    `SELECT c.report_number, c.lab_name, min(ls.collected_on)::text AS sampled_from, max(ls.collected_on)::text AS sampled_to,
            c.received_on::text, min((lr.analysed_at AT TIME ZONE st.time_zone)::date)::text AS analysed_from,
            max((lr.analysed_at AT TIME ZONE st.time_zone)::date)::text AS analysed_to, f.file_name, f.sha256
       FROM lab_certificate c JOIN lab_sample ls ON ls.certificate_id = c.id JOIN lab_result lr ON lr.sample_id = ls.id
       JOIN site st ON st.id = c.site_id LEFT JOIN stored_file f ON f.id = c.file_id
      WHERE ls.discharge_point_id = ANY($1::uuid[]) AND ls.collected_on BETWEEN $2 AND $3
      GROUP BY c.id, f.file_name, f.sha256 ORDER BY min(ls.collected_on), c.report_number`,
    [pointIds, period.startsOn, period.endsOn],
  );
  const shipments = await db.query(
    `SELECT shipped_on::text, document_kind, document_number, waste_description, quantity_litres, signed_copy_received_on::text
       FROM shipment WHERE site_id = $1 AND shipped_on BETWEEN $2 AND $3 ORDER BY shipped_on, document_number`,
    [period.siteId, period.startsOn, period.endsOn],
  );
  const flows = await db.query(
    `SELECT f.day::text, d.code AS point_code, f.value, f.unit FROM flow_reading f JOIN discharge_point d ON d.id = f.discharge_point_id
      WHERE f.discharge_point_id = ANY($1::uuid[]) AND f.day BETWEEN $2 AND $3 ORDER BY f.day, d.code`,
    [pointIds, period.startsOn, period.endsOn],
  );
  const followUps = await db.query(
    `SELECT f.title, ${localText('s.time_zone', 'f.due_at')} AS due_at, f.status, ${localText('s.time_zone', 'f.closed_at')} AS closed_at, f.closing_note
       FROM follow_up f JOIN site s ON s.id = f.site_id
      WHERE f.site_id = $1 AND f.source_id = ANY($2::uuid[]) ORDER BY f.due_at, f.title`,
    [period.siteId, findingSourceIds(summary)],
  );
  const statement = certificationStatements[period.permitKind];
  const number = (value: string | null) => (value === null ? null : Number(value));
  return {
    company: facility.company,
    site: { name: facility.site, address: facility.address, timeZone: facility.time_zone },
    permit: { number: facility.number, kind: facility.kind, issuingAuthority: facility.issuing_authority },
    points,
    summary,
    statement: { section: `${statement.section}, as ${statement.requiredBy} requires`, text: statement.text },
    samples: samples.map((s: Record<string, string | null> & { findings: string[] }) => ({
      sampledAt: s.sampled_at!,
      pointCode: s.point_code!,
      parameter: s.parameter!,
      result: shownValue({
        qualifier: s.qualifier ?? null,
        value_reported: s.value_reported!,
        fraction: s.fraction ?? null,
        method: s.method!,
        unit: s.unit!,
        ml: s.ml,
      }),
      unit: s.unit!,
      mdl: number(s.mdl ?? null),
      ml: number(s.ml ?? null),
      method: s.method!,
      lab: s.lab_name!,
      reportNumber: s.report_number!,
      findings: s.findings,
    })),
    certificates: certificates.map((c: Record<string, string | null>) => ({
      reportNumber: c.report_number!,
      lab: c.lab_name!,
      sampledFrom: c.sampled_from!,
      sampledTo: c.sampled_to!,
      receivedOn: c.received_on!,
      analysedFrom: c.analysed_from,
      analysedTo: c.analysed_to,
      fileName: c.file_name,
      sha256: c.sha256,
    })),
    shipments: shipments.map((s: Record<string, string | null>) => ({
      shippedOn: s.shipped_on!,
      documentKind: s.document_kind!,
      documentNumber: s.document_number!,
      wasteDescription: s.waste_description ?? '',
      quantityLitres: Number(s.quantity_litres),
      signedCopyReceivedOn: s.signed_copy_received_on,
    })),
    flows: flows.map((f: { day: string; point_code: string; value: string; unit: string }) => ({
      day: f.day,
      pointCode: f.point_code,
      value: Number(f.value),
      unit: f.unit,
    })),
    followUps: followUps.map((f: Record<string, string | null>) => ({
      title: f.title!,
      dueAt: f.due_at!,
      status: f.status!,
      closedAt: f.closed_at,
      closingNote: f.closing_note,
    })),
    generatedAt: facility.generated_at,
  };
}
