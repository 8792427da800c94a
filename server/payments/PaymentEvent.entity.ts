import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** A provider event already handled: its id is the key, so a second delivery finds it and changes nothing. */
@Entity({ name: 'payment_events' })
export class PaymentEvent {
  @PrimaryColumn({ type: 'varchar', length: 255 })
  id!: string;

  @Column({ type: 'varchar', length: 80 })
  type!: string;

  @Column({ name: 'order_id', type: 'uuid', nullable: true })
  orderId!: string | null;

  @Column({ type: 'varchar', length: 40 })
  outcome!: string;

  @CreateDateColumn({ name: 'received_at', type: 'timestamptz' })
  receivedAt!: Date;
}
