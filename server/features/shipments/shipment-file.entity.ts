import { Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Shipment } from './shipment.entity.js';
import { StoredFile } from '../../kernel/files/stored-file.entity.js';

@Entity('shipment_file')
export class ShipmentFile {
  @PrimaryColumn({ type: 'uuid', name: 'shipment_id' })
  shipmentId: string;

  @ManyToOne(() => Shipment, { onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'shipment_id', foreignKeyConstraintName: 'shipment_file_shipment_id_fkey' })
  shipment?: Shipment;

  @PrimaryColumn({ type: 'uuid', name: 'file_id' })
  fileId: string;

  @ManyToOne(() => StoredFile, { onDelete: 'NO ACTION' })
  @JoinColumn({ name: 'file_id', foreignKeyConstraintName: 'shipment_file_file_id_fkey' })
  file?: StoredFile;
}
