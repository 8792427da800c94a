import { Column, Entity, PrimaryColumn } from 'typeorm';

/** An adapter kit a spring needs on one fitment; it goes in the cart with the spring. */
@Entity({ name: 'adapter_needs' })
export class AdapterNeed {
  @PrimaryColumn({ name: 'fitment_id', type: 'uuid' })
  fitmentId!: string;

  @PrimaryColumn({ name: 'spring_id', type: 'uuid' })
  springId!: string;

  @PrimaryColumn({ name: 'adapter_id', type: 'uuid' })
  adapterId!: string;

  @Column({ type: 'int' })
  quantity!: number;
}
