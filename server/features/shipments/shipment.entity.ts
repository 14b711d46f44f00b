import { Check, Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { numeric } from '../../db/numeric-transformer.js';
import { Site } from '../../kernel/sites/site.entity.js';
import { User } from '../../kernel/people/user.entity.js';

@Check(
  'shipment_document_kind_check',
  `((document_kind)::text = ANY ((ARRAY['hazardous-waste-manifest'::character varying, 'used-oil-bill-of-lading'::character varying, 'non-hazardous-manifest'::character varying])::text[]))`,
)
@Check('shipment_quantity_check', `(quantity > (0)::numeric)`)
@Check('shipment_quantity_unit_check', `((quantity_unit)::text = ANY ((ARRAY['gal'::character varying, 'L'::character varying])::text[]))`)
@Check('shipment_check', `((signed_copy_received_on IS NULL) OR (signed_copy_received_on >= shipped_on))`)
// Unique by site, kind and the compared form of the number: an expression index (migration DocumentKeys).
@Index('UQ_shipment_document', { synchronize: false })
@Index('IDX_shipment_site_day', ['siteId', 'shippedOn'])
@Entity('shipment')
export class Shipment {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'site_id' })
  siteId: string;

  @ManyToOne(() => Site, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'site_id', foreignKeyConstraintName: 'shipment_site_id_fkey' })
  site?: Site;

  @Column({ type: 'date', name: 'shipped_on' })
  shippedOn: string;

  @Column({ type: 'varchar', name: 'document_kind', length: 32 })
  documentKind: string;

  @Column({ type: 'varchar', name: 'document_number', length: 40 })
  documentNumber: string;

  @Column({ type: 'varchar', name: 'transporter_name', length: 200 })
  transporterName: string;

  @Column({ type: 'char', name: 'transporter_epa_id', length: 12 })
  transporterEpaId: string;

  @Column({ type: 'varchar', name: 'receiver_name', length: 200 })
  receiverName: string;

  @Column({ type: 'char', name: 'receiver_epa_id', length: 12 })
  receiverEpaId: string;

  @Column({ type: 'varchar', name: 'waste_description', length: 300 })
  wasteDescription: string;

  @Column({ type: 'numeric', precision: 12, scale: 2, transformer: numeric })
  quantity: number;

  @Column({ type: 'varchar', name: 'quantity_unit', length: 4 })
  quantityUnit: string;

  @Column({ type: 'numeric', name: 'quantity_litres', precision: 14, scale: 6, transformer: numeric })
  quantityLitres: number;

  @Column({ type: 'numeric', name: 'total_halogens_ppm', precision: 10, scale: 1, nullable: true, transformer: numeric })
  totalHalogensPpm: number | null;

  @Column({ type: 'boolean', name: 'burned_as_fuel', default: false })
  burnedAsFuel: boolean;

  @Column({ type: 'numeric', name: 'arsenic_ppm', precision: 10, scale: 2, nullable: true, transformer: numeric })
  arsenicPpm: number | null;

  @Column({ type: 'numeric', name: 'cadmium_ppm', precision: 10, scale: 2, nullable: true, transformer: numeric })
  cadmiumPpm: number | null;

  @Column({ type: 'numeric', name: 'chromium_ppm', precision: 10, scale: 2, nullable: true, transformer: numeric })
  chromiumPpm: number | null;

  @Column({ type: 'numeric', name: 'lead_ppm', precision: 10, scale: 2, nullable: true, transformer: numeric })
  leadPpm: number | null;

  @Column({ type: 'numeric', name: 'flash_point_f', precision: 6, scale: 1, nullable: true, transformer: numeric })
  flashPointF: number | null;

  @Column({ type: 'date', name: 'signed_copy_received_on', nullable: true })
  signedCopyReceivedOn: string | null;

  @Column({ type: 'jsonb', default: '[]' })
  flags: unknown;

  @Column({ type: 'uuid', name: 'created_by' })
  createdBy: string;

  @ManyToOne(() => User, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'created_by', foreignKeyConstraintName: 'shipment_created_by_fkey' })
  createdByRef?: User;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
