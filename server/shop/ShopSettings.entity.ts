import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import type { CurrencyCode } from '../../shared/money';

/** The shop's own figures: name and address for receipts, VAT, shipping and how long a reservation holds. */
@Entity({ name: 'shop_settings' })
export class ShopSettings {
  @PrimaryColumn({ type: 'smallint', default: 1 })
  id!: number;

  @Column({ name: 'shop_name', type: 'varchar', length: 120 })
  shopName!: string;

  @Column({ name: 'shop_address', type: 'text' })
  shopAddress!: string;

  @Column({ type: 'char', length: 3, default: 'EUR' })
  currency!: CurrencyCode;

  @Column({ name: 'vat_rate_bp', type: 'int' })
  vatRateBasisPoints!: number;

  @Column({ name: 'shipping_flat_cents', type: 'int' })
  shippingFlatCents!: number;

  @Column({ name: 'free_shipping_threshold_cents', type: 'int' })
  freeShippingThresholdCents!: number;

  // Null: the RESERVATION_MINUTES setting stands.
  @Column({ name: 'reservation_minutes', type: 'int', nullable: true })
  reservationMinutes!: number | null;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;
}
