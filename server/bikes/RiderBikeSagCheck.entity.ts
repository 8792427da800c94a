import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { BikeSagCheckDto } from '../../shared/bikes';
import type { SagCheckResult } from '../../shared/engine/types';

/** One sag check on a saved bike: the readings and the answer the server computed from them. */
@Entity({ name: 'rider_bike_sag_checks' })
export class RiderBikeSagCheck {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'bike_id', type: 'uuid' })
  bikeId!: string;

  @Column({ name: 'end_name', type: 'varchar', length: 5 })
  end!: 'rear' | 'front';

  @Column({ type: 'jsonb' })
  readings!: BikeSagCheckDto['readings'];

  @Column({ type: 'jsonb' })
  targets!: BikeSagCheckDto['targets'];

  @Column({ type: 'jsonb' })
  result!: SagCheckResult;

  @Column({ name: 'checked_at', type: 'timestamptz', default: () => 'now()' })
  checkedAt!: Date;
}
