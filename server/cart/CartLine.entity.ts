import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { SpringVerdict } from '../../shared/engine/types';

/** A product in a cart at the price it had when added; a spring-set line also names its set. */
@Entity({ name: 'cart_lines' })
export class CartLine {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'cart_id', type: 'uuid' })
  cartId!: string;

  @Column({ name: 'product_id', type: 'uuid' })
  productId!: string;

  @Column({ type: 'int' })
  quantity!: number;

  @Column({ name: 'unit_price_cents', type: 'int' })
  unitPriceCents!: number;

  @Column({ name: 'spring_set_id', type: 'uuid', nullable: true })
  springSetId!: string | null;

  // The engine's verdict for a spring line; anything but ok was accepted by the rider explicitly.
  @Column({ type: 'varchar', length: 20, nullable: true })
  verdict!: SpringVerdict | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
