import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

export interface RefundLine {
  orderLineId: string;
  quantity: number;
  restock: boolean;
}

/** Money given back through the provider, whole or for some lines. */
@Entity({ name: 'refunds' })
export class Refund {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'order_id', type: 'uuid' })
  orderId!: string;

  @Column({ name: 'provider_refund_id', type: 'varchar', length: 255 })
  providerRefundId!: string;

  @Column({ name: 'amount_cents', type: 'int' })
  amountCents!: number;

  @Column({ type: 'text', default: '' })
  reason!: string;

  @Column({ type: 'jsonb', default: [] })
  lines!: RefundLine[];

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
