import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

export interface ShipmentLine {
  orderLineId: string;
  quantity: number;
}

/** One parcel that left for an order: carrier, tracking number and which units were in it. */
@Entity({ name: 'shipments' })
export class Shipment {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'order_id', type: 'uuid' })
  orderId!: string;

  @Column({ type: 'varchar', length: 60 })
  carrier!: string;

  @Column({ name: 'tracking_number', type: 'varchar', length: 60 })
  trackingNumber!: string;

  @Column({ type: 'jsonb' })
  lines!: ShipmentLine[];

  // True when units of the order were still short and wait for a later parcel.
  @Column({ name: 'back_ordered', type: 'boolean', default: false })
  backOrdered!: boolean;

  @Column({ name: 'shipped_by', type: 'uuid', nullable: true })
  shippedBy!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
