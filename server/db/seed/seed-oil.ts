import { DateTime } from 'luxon';
import type { EntityManager } from 'typeorm';
import { upkeepChecklists, upkeepItemLabels } from '../../contracts/upkeep-checklists.js';
import { usedOilFlags } from '../../domain/used-oil.js';

/**
 * Equipment, 18 months of oil log entries with a seasonal swing (more tramp oil in the summer
 * months, when coolant runs hot), upkeep checks with a few failures, and shipments every few
 * weeks, among them one signed copy never returned and one halogen result over 1,000 ppm.
 */
const equipmentBySite = {
  north: [
    {
      name: 'Belt skimmer, coolant sump A',
      kind: 'belt-skimmer',
      serves: 'Central coolant sump A (CNC line 1)',
      rated: 3,
      unit: 'gal/h',
      medium: 'Stainless steel belt',
      interval: 14,
      base: 1.6,
    },
    {
      name: 'Drum skimmer, parts washer',
      kind: 'drum-skimmer',
      serves: 'Aqueous parts washer tank',
      rated: 8,
      unit: 'gal/h',
      medium: 'Oleophilic drum',
      interval: 30,
      base: 1.1,
    },
    {
      name: 'Coalescing separator OWS-1',
      kind: 'oil-water-separator',
      serves: 'Floor drains to OF-001',
      rated: 40,
      unit: 'L/h',
      medium: null,
      interval: 30,
      base: 2.8,
    },
  ],
  east: [
    {
      name: 'Disc skimmer, rinse tank',
      kind: 'disc-skimmer',
      serves: 'Alkaline cleaner rinse tank',
      rated: 10,
      unit: 'L/h',
      medium: 'Polymer discs',
      interval: 14,
      base: 3.9,
    },
    {
      name: 'Tube skimmer, wash-line sump',
      kind: 'tube-skimmer',
      serves: 'Wash-line sump (IS-201)',
      rated: 1,
      unit: 'gal/h',
      medium: 'Floating polymer tube',
      interval: 14,
      base: 2.4,
    },
  ],
} as const;

/** What the demo operators wrote beside a failed item. */
const failureNotes: Record<string, string> = {
  'wipers-even': 'Left wiper worn, streaks of oil past it',
  'trough-clear': 'Chips and swarf packed in the trough',
  'oil-layer': 'Oil layer above the mark: pumped out the same day',
  'coalescer-clean': 'Coalescer pack fouled with fines: rinsed and refitted',
  'disc-immersion': 'Level dropped below the disc edge after the weekend',
  'drum-immersion': 'Drum barely touching the surface at low level',
  'tube-condition': 'Tube hardened near the drive: ordered a new one',
  'scrapers-even': 'Scraper block worn on one side',
};

const carriers = {
  // Invented identification numbers: 'ZZ' is no state's code, so they cannot be mistaken for real ones.
  transporter: { name: 'Kestrel Fluid Haulers', epaId: 'ZZR000417233' },
  receiver: { name: 'Marrowby Oil Recovery', epaId: 'ZZD000982114' },
};

export async function seedOil(
  manager: EntityManager,
  sites: Array<{ key: 'north' | 'east'; id: string; timeZone: string }>,
  operatorId: string,
  today = DateTime.now(),
): Promise<void> {
  const existing = await manager.query('SELECT 1 FROM equipment LIMIT 1');
  if (existing.length > 0) return;
  for (const [salt, site] of sites.entries()) {
    const localToday = today.setZone(site.timeZone).startOf('day');
    const start = localToday.startOf('month').minus({ months: 17 });
    let collectedLitres = 0;
    for (const [index, spec] of equipmentBySite[site.key].entries()) {
      const [equipment] = await manager.query(
        `INSERT INTO equipment (site_id, name, kind, serves, rated_capacity, rated_unit, medium_material, upkeep_interval_days)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8) RETURNING id`,
        [site.id, spec.name, spec.kind, spec.serves, spec.rated, spec.unit, spec.medium, spec.interval],
      );
      const entries: unknown[][] = [];
      for (let day = start; day <= localToday.minus({ days: 1 }); day = day.plus({ days: 1 })) {
        if (day.weekday > 5) continue;
        const season = 1 + 0.35 * Math.sin(((day.month - 4) / 12) * 2 * Math.PI);
        const wobble = 0.75 + ((day.ordinal * 7 + index * 13 + salt * 5) % 50) / 100;
        const gallons = Math.round(spec.base * season * wobble * 10) / 10;
        const hours = 8 + ((day.ordinal + index) % 3) * 2;
        const litres = gallons * 3.785411784;
        collectedLitres += litres;
        const seen = gallons > spec.base * 1.2 ? ['free-oil', 'sheen'] : ['sheen'];
        entries.push([equipment.id, site.id, day.toISODate(), litres, gallons, 'gal', hours, 24 + (day.month % 6), seen, operatorId]);
      }
      // One statement a piece of equipment: hundreds of rows, one round trip.
      await manager.query(
        `INSERT INTO oil_log_entry (equipment_id, site_id, collected_on, volume_litres, entered_volume, entered_unit, hours_run, water_temperature_c, observations, entered_by)
         SELECT a, b, c, d, e, f, g, h, string_to_array(i, ','), j FROM unnest($1::uuid[], $2::uuid[], $3::date[], $4::numeric[], $5::numeric[], $6::text[], $7::numeric[], $8::numeric[], $9::text[], $10::uuid[])
           AS t(a, b, c, d, e, f, g, h, i, j)`,
        [0, 1, 2, 3, 4, 5, 6, 7, 8, 9].map((column) =>
          entries.map((entry) => (column === 8 ? (entry[8] as string[]).join(',') : entry[column])),
        ),
      );

      let check = 0;
      // Checks keep pace with each interval; the north belt skimmer's latest one was skipped, so it shows overdue.
      const lastCheckBefore =
        site.key === 'north' && index === 0 ? localToday.minus({ days: spec.interval + 3 }) : localToday.minus({ days: 1 });
      for (let day = start.plus({ days: 3 }); day <= lastCheckBefore; day = day.plus({ days: spec.interval })) {
        check += 1;
        const checklist = upkeepChecklists[spec.kind];
        const failing = (check + index + salt) % 11 === 0 ? checklist[check % 2 ? 0 : 2]!.key : null;
        const items = checklist.map((item) => ({
          key: item.key,
          outcome: item.key === failing ? 'fail' : 'pass',
          note: item.key === failing ? (failureNotes[item.key] ?? 'Out of order at the check') : '',
          photoFileId: null,
        }));
        const [row] = await manager.query(
          `INSERT INTO upkeep_check (equipment_id, site_id, checked_on, items, immersion_value, immersion_unit, failed_count, checked_by)
           VALUES ($1, $2, $3, $4, $5, 'in', $6, $7) RETURNING id`,
          [
            equipment.id,
            site.id,
            day.toISODate(),
            JSON.stringify(items),
            spec.kind === 'oil-water-separator' ? null : 4,
            failing ? 1 : 0,
            operatorId,
          ],
        );
        if (failing) {
          await manager.query(
            `INSERT INTO follow_up (site_id, kind, source_entity, source_id, title, due_at, status, closed_at, closing_note)
             VALUES ($1, 'upkeep-failed', 'upkeep-check', $2, $3, $4, 'done', $5, 'Fixed on the floor')`,
            [
              site.id,
              row.id,
              `Fix ${spec.name}: ${upkeepItemLabels[failing]!.toLowerCase()}`,
              day.plus({ days: 7 }).toJSDate(),
              day.plus({ days: 2 }).toJSDate(),
            ],
          );
        }
      }
    }

    // Shipments: roughly every three and a half weeks, taking what was collected since the last one.
    let shipmentNumber = 0;
    let shippedLitres = 0;
    for (
      let day = start.plus({ days: 20 });
      day <= localToday.minus({ days: 3 });
      day = day.plus({ days: 24 + (shipmentNumber % 3) * 3 })
    ) {
      shipmentNumber += 1;
      const collectedBy = await manager.query(
        'SELECT coalesce(sum(volume_litres), 0) AS litres FROM oil_log_entry WHERE site_id = $1 AND collected_on <= $2',
        [site.id, day.toISODate()],
      );
      const litres = Math.max(0, Math.round(Number(collectedBy[0].litres) - shippedLitres));
      if (litres < 200) continue;
      shippedLitres += litres;
      const gallons = Math.round(litres / 3.785411784);
      const age = localToday.diff(day, 'days').days;
      // North's signed copy after ~70 days never came back; everything else returns in 9–20 days.
      const neverReturned = site.key === 'north' && age > 62 && age < 90;
      // Copies come back 9–20 days after shipping; one not back by today is simply still out.
      const comesBack = day.plus({ days: 9 + (shipmentNumber % 12) });
      const returned = neverReturned || comesBack >= localToday ? null : comesBack.toISODate();
      const halogens = site.key === 'east' && shipmentNumber === 7 ? 1340 : 180 + ((shipmentNumber * 37) % 300);
      const analysis = {
        totalHalogensPpm: halogens,
        burnedAsFuel: true,
        arsenicPpm: 1.2,
        cadmiumPpm: 0.4,
        chromiumPpm: 2.1,
        leadPpm: 18,
        flashPointF: 210,
      };
      // Used oil for recycling travels on the hauler's used-oil bill of lading (40 CFR 279); the
      // separator's sludge clean-outs, every fourth load, go on a hazardous waste manifest, whose
      // signed copy 40 CFR 262.42 follows. The manifest suffix 'QZD' is invented, not a printer's.
      const onManifest = neverReturned || shipmentNumber % 4 === 0;
      const document = onManifest
        ? `${String(100000000 + salt * 5000000 + shipmentNumber * 7919).slice(0, 9)}QZD`
        : `UOB-${day.toFormat('yyyyMMdd')}-${site.key === 'north' ? 'N' : 'E'}${String(shipmentNumber).padStart(2, '0')}`;
      await manager.query(
        `INSERT INTO shipment (site_id, shipped_on, document_kind, document_number, transporter_name, transporter_epa_id, receiver_name, receiver_epa_id,
           waste_description, quantity, quantity_unit, quantity_litres, total_halogens_ppm, burned_as_fuel, arsenic_ppm, cadmium_ppm, chromium_ppm, lead_ppm,
           flash_point_f, signed_copy_received_on, flags, created_by)
         VALUES ($1, $2, $19, $3, $4, $5, $6, $7, $20, $8, 'gal', $9,
           $10, true, $11, $12, $13, $14, $15, $16, $17, $18)`,
        [
          site.id,
          day.toISODate(),
          document,
          carriers.transporter.name,
          carriers.transporter.epaId,
          carriers.receiver.name,
          carriers.receiver.epaId,
          gallons,
          gallons * 3.785411784,
          halogens,
          analysis.arsenicPpm,
          analysis.cadmiumPpm,
          analysis.chromiumPpm,
          analysis.leadPpm,
          analysis.flashPointF,
          returned,
          JSON.stringify(usedOilFlags(analysis)),
          operatorId,
          onManifest ? 'hazardous-waste-manifest' : 'used-oil-bill-of-lading',
          onManifest
            ? 'Oily sludge and water from the separator clean-out, in 55-gal drums'
            : 'Used oil for recycling, from skimmers and separators, in 55-gal drums',
        ],
      );
    }
    await manager.query('UPDATE site SET oil_opening_balance_litres = $2, oil_opening_balance_on = $3 WHERE id = $1', [
      site.id,
      150,
      start.minus({ days: 1 }).toISODate(),
    ]);
    void collectedLitres;
  }
}
