import { Column, Entity, UpdateDateColumn } from 'typeorm';
import type { LoadCaseInputDto, LoadSetInputDto } from '../../shared/catalogue/recommendation.dto';
import { ChosenBikeColumns } from '../fitment/chosen-bike-columns';

/** A rider's saved bike: the finder's bike, style, load, load cases and chosen springs under a nickname. */
@Entity({ name: 'rider_bikes' })
export class RiderBike extends ChosenBikeColumns {
  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @Column({ type: 'varchar', length: 60 })
  nickname!: string;

  @Column({ type: 'jsonb' })
  load!: LoadSetInputDto;

  @Column({ type: 'jsonb', default: () => `'[]'` })
  cases!: LoadCaseInputDto[];

  @Column({ name: 'fork_spring_id', type: 'uuid', nullable: true })
  forkSpringId!: string | null;

  @Column({ name: 'shock_spring_id', type: 'uuid', nullable: true })
  shockSpringId!: string | null;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;
}
