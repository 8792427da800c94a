import { Column, Entity } from 'typeorm';
import type { SpringSetupDto } from '../../shared/commerce/cart.dto';
import type { ResolvedLoadDto } from '../../shared/catalogue';
import { ChosenBikeColumns } from '../fitment/chosen-bike-columns';

/** A bike, its load and the engine's figures for the chosen springs; cart and order lines point at it and never change it. */
@Entity({ name: 'spring_sets' })
export class SpringSet extends ChosenBikeColumns {
  /** The load as the rider gave it (the recommendation request). */
  @Column({ type: 'jsonb' })
  request!: Record<string, unknown>;

  @Column({ type: 'jsonb' })
  loads!: ResolvedLoadDto[];

  @Column({ type: 'jsonb' })
  setup!: SpringSetupDto[];
}
