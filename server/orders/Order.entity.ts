import { Column, Entity } from 'typeorm';
import type { CurrencyCode } from '../../shared/money';
import type { CancelReason, FulfilmentStatus, OrderStatus, PaymentStatus } from '../../shared/order-status';
import type { ShippingAddressDto } from '../../shared/commerce/checkout.dto';
import { PaidRecordColumns } from './paid-record-columns';

/** An order: three separate states, the totals it was sold at, the payment it waits for, and when each milestone came. */
@Entity({ name: 'orders' })
export class Order extends PaidRecordColumns {
  @Column({ name: 'user_id', type: 'uuid', nullable: true })
  userId!: string | null;

  @Column({ name: 'cart_id', type: 'uuid', nullable: true })
  cartId!: string | null;

  @Column({ name: 'customer_name', type: 'varchar', length: 120 })
  customerName!: string;

  @Column({ name: 'shipping_address', type: 'jsonb' })
  shippingAddress!: ShippingAddressDto;

  @Column({ type: 'varchar', length: 20 })
  status!: OrderStatus;

  @Column({ name: 'payment_status', type: 'varchar', length: 20 })
  paymentStatus!: PaymentStatus;

  @Column({ name: 'fulfilment_status', type: 'varchar', length: 20 })
  fulfilmentStatus!: FulfilmentStatus;

  @Column({ name: 'cancel_reason', type: 'varchar', length: 30, nullable: true })
  cancelReason!: CancelReason | null;

  @Column({ type: 'char', length: 3 })
  currency!: CurrencyCode;

  @Column({ name: 'subtotal_cents', type: 'int' })
  subtotalCents!: number;

  @Column({ name: 'shipping_cents', type: 'int' })
  shippingCents!: number;

  @Column({ name: 'vat_cents', type: 'int' })
  vatCents!: number;

  @Column({ name: 'total_cents', type: 'int' })
  totalCents!: number;

  @Column({ name: 'vat_rate_bp', type: 'int' })
  vatRateBasisPoints!: number;

  @Column({ name: 'refunded_cents', type: 'int', default: 0 })
  refundedCents!: number;

  @Column({ name: 'payment_failure', type: 'text', nullable: true })
  paymentFailure!: string | null;

  @Column({ name: 'reserved_until', type: 'timestamptz' })
  reservedUntil!: Date;

  // True while the order's units are out of stock on its account; released once, on cancel.
  @Column({ name: 'stock_held', type: 'boolean', default: true })
  stockHeld!: boolean;

  @Column({ name: 'packed_by', type: 'uuid', nullable: true })
  packedBy!: string | null;

  @Column({ name: 'paid_at', type: 'timestamptz', nullable: true })
  paidAt!: Date | null;

  @Column({ name: 'payment_failed_at', type: 'timestamptz', nullable: true })
  paymentFailedAt!: Date | null;

  @Column({ name: 'confirmed_at', type: 'timestamptz', nullable: true })
  confirmedAt!: Date | null;

  @Column({ name: 'cancelled_at', type: 'timestamptz', nullable: true })
  cancelledAt!: Date | null;

  @Column({ name: 'refunded_at', type: 'timestamptz', nullable: true })
  refundedAt!: Date | null;

  @Column({ name: 'packed_at', type: 'timestamptz', nullable: true })
  packedAt!: Date | null;

  @Column({ name: 'delivered_at', type: 'timestamptz', nullable: true })
  deliveredAt!: Date | null;

  @Column({ name: 'completed_at', type: 'timestamptz', nullable: true })
  completedAt!: Date | null;
}
