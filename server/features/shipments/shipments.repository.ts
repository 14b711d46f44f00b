import type { DataSource, DeepPartial, EntityManager, QueryDeepPartialEntity } from 'typeorm';
import type { Page } from '../../contracts/paging.js';
import type { shipmentSortKeys, ShipmentView } from '../../contracts/shipments.js';
import {
  daysLeft,
  manifestDeadlines,
  SIGNED_COPY_DOCUMENT,
  type GeneratorStatus,
  type ManifestRule,
} from '../../domain/manifest-deadlines.js';
import { queryPage } from '../../db/page.js';
import { ShipmentFile } from './shipment-file.entity.js';
import { Shipment } from './shipment.entity.js';

type Db = DataSource | EntityManager;
const n = (value: string | null) => (value === null ? null : Number(value));

/** The first 262.42 step of each generator status and rule, from the domain rule, for SQL filters. */
const firstSteps = (['large', 'small'] as const).flatMap((status) =>
  (['current', 'before-2025'] as const).map((rule) => ({ status, rule, days: manifestDeadlines(status, rule, '2000-01-01')[0]!.days })),
);
/** SQL for those days at the shipment's site; `at` is the position of the three array parameters. */
const firstStepSql = (
  at: number,
) => `(SELECT days FROM unnest($${at}::text[], $${at + 1}::text[], $${at + 2}::int[]) AS f(status, rule, days)
  WHERE f.status = st.generator_status AND f.rule = st.manifest_rule)`;
const firstStepParams = () => [firstSteps.map((f) => f.status), firstSteps.map((f) => f.rule), firstSteps.map((f) => f.days)];

// 40 CFR 262.42 is about the manifest's signed copy: other papers have no such deadline.
const statusSql = (at: number) => `CASE WHEN s.signed_copy_received_on IS NOT NULL THEN 'complete'
  WHEN s.document_kind <> '${SIGNED_COPY_DOCUMENT}' THEN 'not-tracked'
  WHEN ${firstStepSql(at)} IS NOT NULL AND (now() AT TIME ZONE st.time_zone)::date > s.shipped_on + ${firstStepSql(at)} THEN 'overdue'
  ELSE 'awaiting-signed-copy' END`;

// Raw SQL: the signed-copy status is computed in the query so lists can filter and sort by it.
const select = (
  at: number,
) => `SELECT s.*, st.generator_status, st.manifest_rule, (now() AT TIME ZONE st.time_zone)::date::text AS today, ${statusSql(at)} AS status,
    coalesce((SELECT json_agg(json_build_object('id', f.id, 'fileName', f.file_name, 'mediaType', f.media_type, 'sizeBytes', f.size_bytes, 'sha256', f.sha256))
                FROM shipment_file sf JOIN stored_file f ON f.id = sf.file_id WHERE sf.shipment_id = s.id), '[]') AS files
  FROM shipment s JOIN site st ON st.id = s.site_id`;

interface ShipmentRow {
  id: string;
  created_at: Date;
  site_id: string;
  shipped_on: string;
  document_kind: ShipmentView['documentKind'];
  document_number: string;
  transporter_name: string;
  transporter_epa_id: string;
  receiver_name: string;
  receiver_epa_id: string;
  waste_description: string;
  quantity: string;
  quantity_unit: ShipmentView['quantityUnit'];
  quantity_litres: string;
  total_halogens_ppm: string | null;
  burned_as_fuel: boolean;
  arsenic_ppm: string | null;
  cadmium_ppm: string | null;
  chromium_ppm: string | null;
  lead_ppm: string | null;
  flash_point_f: string | null;
  signed_copy_received_on: string | null;
  status: ShipmentView['status'];
  flags: ShipmentView['flags'];
  files: ShipmentView['files'];
  generator_status: GeneratorStatus;
  manifest_rule: ManifestRule;
  today: string;
}

function view(row: ShipmentRow): ShipmentView {
  const deadlines =
    row.signed_copy_received_on || row.document_kind !== SIGNED_COPY_DOCUMENT
      ? []
      : manifestDeadlines(row.generator_status, row.manifest_rule, row.shipped_on).map((d) => ({
          ...d,
          daysLeft: daysLeft(d.dueOn, row.today),
        }));
  return {
    id: row.id,
    siteId: row.site_id,
    shippedOn: row.shipped_on,
    documentKind: row.document_kind,
    documentNumber: row.document_number,
    transporterName: row.transporter_name,
    transporterEpaId: row.transporter_epa_id,
    receiverName: row.receiver_name,
    receiverEpaId: row.receiver_epa_id,
    wasteDescription: row.waste_description,
    quantity: Number(row.quantity),
    quantityUnit: row.quantity_unit,
    quantityLitres: Number(row.quantity_litres),
    totalHalogensPpm: n(row.total_halogens_ppm),
    burnedAsFuel: row.burned_as_fuel,
    arsenicPpm: n(row.arsenic_ppm),
    cadmiumPpm: n(row.cadmium_ppm),
    chromiumPpm: n(row.chromium_ppm),
    leadPpm: n(row.lead_ppm),
    flashPointF: n(row.flash_point_f),
    signedCopyReceivedOn: row.signed_copy_received_on,
    enteredAt: row.created_at.toISOString(),
    status: row.status,
    deadlines,
    flags: row.flags,
    files: row.files,
  };
}

export async function findShipment(db: Db, id: string): Promise<ShipmentView | null> {
  const [row]: ShipmentRow[] = await db.query(`${select(2)} WHERE s.id = $1`, [id, ...firstStepParams()]);
  return row ? view(row) : null;
}

const sorts: Record<(typeof shipmentSortKeys)[number], string> = {
  shippedOn: 's.shipped_on',
  documentNumber: 's.document_number',
  quantityLitres: 's.quantity_litres',
};

export async function pageShipments(
  db: Db,
  siteIds: string[],
  query: {
    page: number;
    pageSize: number;
    sortBy?: (typeof shipmentSortKeys)[number];
    sortDesc?: boolean;
    status?: string;
    search?: string;
  },
): Promise<Page<ShipmentView>> {
  const search = query.search ? `%${query.search.replace(/[\\%_]/g, '\\$&')}%` : null;
  return queryPage(
    db,
    {
      select: select(4),
      countFrom: 'FROM shipment s JOIN site st ON st.id = s.site_id',
      where: `s.site_id = ANY($1::uuid[]) AND ($2::text IS NULL OR ${statusSql(4)} = $2)
      AND ($3::text IS NULL OR s.document_number ILIKE $3 OR s.transporter_name ILIKE $3 OR s.receiver_name ILIKE $3)`,
      order: `${query.sortBy ? sorts[query.sortBy] : 's.shipped_on'} ${query.sortBy && !query.sortDesc ? 'ASC' : 'DESC'}, s.id`,
      params: [siteIds, query.status ?? null, search, ...firstStepParams()],
    },
    query,
    view,
  );
}

export async function insertShipment(manager: EntityManager, fields: DeepPartial<Shipment>): Promise<string> {
  return (await manager.save(Shipment, manager.create(Shipment, fields))).id;
}

export async function updateShipment(manager: EntityManager, id: string, changes: QueryDeepPartialEntity<Shipment>): Promise<void> {
  await manager.update(Shipment, { id }, changes);
}

export async function attachShipmentFile(manager: EntityManager, shipmentId: string, fileId: string): Promise<void> {
  await manager.insert(ShipmentFile, { shipmentId, fileId });
}
