import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { StockReason } from '../../shared/warehouse/stock';

/** One change of a product's on-hand count: how many, why, who, when, and the count it left. */
@Entity({ name: 'stock_movements' })
export class StockMovement {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'product_id', type: 'uuid' })
  productId!: string;

  @Column({ type: 'int' })
  quantity!: number;

  @Column({ type: 'varchar', length: 20 })
  reason!: StockReason;

  @Column({ name: 'order_id', type: 'uuid', nullable: true })
  orderId!: string | null;

  @Column({ name: 'exchange_id', type: 'uuid', nullable: true })
  exchangeId!: string | null;

  @Column({ name: 'delivery_ref', type: 'varchar', length: 60, nullable: true })
  deliveryRef!: string | null;

  @Column({ type: 'text', default: '' })
  note!: string;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId!: string | null;

  @Column({ name: 'stock_after', type: 'int' })
  stockAfter!: number;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
