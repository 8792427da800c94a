import { Column, Entity, PrimaryColumn } from 'typeorm';

/** Staff's word on whether a spring fits a fitment, over what the diameter and length window say. */
@Entity({ name: 'spring_fit_overrides' })
export class SpringFitOverride {
  @PrimaryColumn({ name: 'fitment_id', type: 'uuid' })
  fitmentId!: string;

  @PrimaryColumn({ name: 'product_id', type: 'uuid' })
  productId!: string;

  @Column({ type: 'boolean' })
  fits!: boolean;

  @Column({ type: 'varchar', length: 500, default: '' })
  note!: string;
}
