import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { SpringSetupDto } from '../../shared/commerce/cart.dto';
import type { ResolvedLoadDto, RidingStyle } from '../../shared/catalogue';

/** A bike, its load and the engine's figures for the chosen springs; cart and order lines point at it and never change it. */
@Entity({ name: 'spring_sets' })
export class SpringSet {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'fitment_id', type: 'uuid', nullable: true })
  fitmentId!: string | null;

  @Column({ name: 'bike_label', type: 'varchar', length: 200 })
  bikeLabel!: string;

  @Column({ name: 'riding_style', type: 'varchar', length: 20 })
  ridingStyle!: RidingStyle;

  /** The load as the rider gave it (the recommendation request). */
  @Column({ type: 'jsonb' })
  request!: Record<string, unknown>;

  @Column({ type: 'jsonb' })
  loads!: ResolvedLoadDto[];

  @Column({ type: 'jsonb' })
  setup!: SpringSetupDto[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
