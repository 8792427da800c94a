import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { RidingStyle } from '../../shared/catalogue';
import type { LoadCaseInputDto, LoadSetInputDto } from '../../shared/catalogue/recommendation.dto';

/** A rider's saved bike: the finder's bike, style, load, load cases and chosen springs under a nickname. */
@Entity({ name: 'rider_bikes' })
export class RiderBike {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @Column({ type: 'varchar', length: 60 })
  nickname!: string;

  @Column({ name: 'fitment_id', type: 'uuid', nullable: true })
  fitmentId!: string | null;

  // Kept so the card still names the bike if the staff remove its fitment.
  @Column({ name: 'bike_label', type: 'varchar', length: 200 })
  bikeLabel!: string;

  @Column({ name: 'riding_style', type: 'varchar', length: 20 })
  ridingStyle!: RidingStyle;

  @Column({ type: 'jsonb' })
  load!: LoadSetInputDto;

  @Column({ type: 'jsonb', default: () => `'[]'` })
  cases!: LoadCaseInputDto[];

  @Column({ name: 'fork_spring_id', type: 'uuid', nullable: true })
  forkSpringId!: string | null;

  @Column({ name: 'shock_spring_id', type: 'uuid', nullable: true })
  shockSpringId!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;
}
