import { Check, Column, Entity, PrimaryColumn } from 'typeorm';

/** The last link of the trail's hash chain: one row, written only by the trail's insert trigger. */
@Check('trail_chain_head_only_row_check', 'only_row')
@Entity('trail_chain_head')
export class TrailChainHead {
  @PrimaryColumn({ type: 'boolean', name: 'only_row', default: true })
  onlyRow: boolean;

  @Column({ type: 'bigint' })
  seq: string;

  @Column({ type: 'char', length: 64 })
  hash: string;
}
