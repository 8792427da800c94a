import { Column, Entity } from 'typeorm';
import type { ExchangeReplacementDto, ExchangeSagCheckDto } from '../../shared/commerce/exchange.dto';
import type { ExchangeKind, ExchangeReason, ExchangeState, Settlement } from '../../shared/exchange-status';
import { PaidRecordColumns } from '../orders/paid-record-columns';

/** A rider's request to swap a bought spring for another rate, or to send it back for the money. */
@Entity({ name: 'exchanges' })
export class Exchange extends PaidRecordColumns {
  @Column({ type: 'varchar', length: 10 })
  kind!: ExchangeKind;

  @Column({ type: 'varchar', length: 12 })
  state!: ExchangeState;

  @Column({ type: 'varchar', length: 20 })
  settlement!: Settlement;

  @Column({ name: 'order_id', type: 'uuid' })
  orderId!: string;

  @Column({ name: 'order_line_id', type: 'uuid' })
  orderLineId!: string;

  @Column({ name: 'user_id', type: 'uuid' })
  userId!: string;

  @Column({ name: 'product_id', type: 'uuid', nullable: true })
  productId!: string | null;

  @Column({ type: 'int' })
  quantity!: number;

  @Column({ name: 'paid_unit_cents', type: 'int' })
  paidUnitCents!: number;

  @Column({ name: 'replacement_product_id', type: 'uuid', nullable: true })
  replacementProductId!: string | null;

  /** The replacement as the engine judged it for the order's load, and its price when asked. */
  @Column({ type: 'jsonb', nullable: true })
  replacement!: ExchangeReplacementDto | null;

  @Column({ name: 'difference_cents', type: 'int' })
  differenceCents!: number;

  @Column({ type: 'varchar', length: 10 })
  reason!: ExchangeReason;

  @Column({ name: 'reason_text', type: 'text' })
  reasonText!: string;

  @Column({ name: 'sag_check', type: 'jsonb', nullable: true })
  sagCheck!: ExchangeSagCheckDto | null;

  @Column({ name: 'staff_message', type: 'text' })
  staffMessage!: string;

  @Column({ name: 'decided_by', type: 'uuid', nullable: true })
  decidedBy!: string | null;

  @Column({ name: 'refund_id', type: 'uuid', nullable: true })
  refundId!: string | null;

  @Column({ type: 'varchar', length: 60, nullable: true })
  carrier!: string | null;

  @Column({ name: 'tracking_number', type: 'varchar', length: 80, nullable: true })
  trackingNumber!: string | null;

  @Column({ name: 'decided_at', type: 'timestamptz', nullable: true })
  decidedAt!: Date | null;

  @Column({ name: 'received_at', type: 'timestamptz', nullable: true })
  receivedAt!: Date | null;

  @Column({ name: 'settled_at', type: 'timestamptz', nullable: true })
  settledAt!: Date | null;

}
