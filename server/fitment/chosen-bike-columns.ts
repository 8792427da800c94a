import { Column, CreateDateColumn, PrimaryGeneratedColumn } from 'typeorm';
import type { RidingStyle } from '../../shared/catalogue';

/** The columns of a row that keeps a rider's bike and riding style: a saved bike and a spring set bought for one. */
export abstract class ChosenBikeColumns {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'fitment_id', type: 'uuid', nullable: true })
  fitmentId!: string | null;

  // Kept so the row still names the bike if the staff remove its fitment.
  @Column({ name: 'bike_label', type: 'varchar', length: 200 })
  bikeLabel!: string;

  @Column({ name: 'riding_style', type: 'varchar', length: 20 })
  ridingStyle!: RidingStyle;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
