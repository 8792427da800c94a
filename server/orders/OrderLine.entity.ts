import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { ProductKind } from '../../shared/catalogue';
import type { SpringSetupDto } from '../../shared/commerce/cart.dto';

/** What was sold: name, SKU and unit price copied at purchase, so later catalogue edits never change an order. */
@Entity({ name: 'order_lines' })
export class OrderLine {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ name: 'order_id', type: 'uuid' })
  orderId!: string;

  @Column({ type: 'int' })
  position!: number;

  @Column({ name: 'product_id', type: 'uuid', nullable: true })
  productId!: string | null;

  @Column({ type: 'varchar', length: 40 })
  sku!: string;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'varchar', length: 20 })
  kind!: ProductKind;

  @Column({ name: 'unit_price_cents', type: 'int' })
  unitPriceCents!: number;

  @Column({ type: 'int' })
  quantity!: number;

  @Column({ name: 'line_total_cents', type: 'int' })
  lineTotalCents!: number;

  @Column({ name: 'refunded_quantity', type: 'int', default: 0 })
  refundedQuantity!: number;

  @Column({ name: 'restocked_quantity', type: 'int', default: 0 })
  restockedQuantity!: number;

  @Column({ name: 'picked_quantity', type: 'int', default: 0 })
  pickedQuantity!: number;

  @Column({ name: 'shipped_quantity', type: 'int', default: 0 })
  shippedQuantity!: number;

  @Column({ name: 'spring_set_id', type: 'uuid', nullable: true })
  springSetId!: string | null;

  @Column({ type: 'jsonb', nullable: true })
  setup!: SpringSetupDto | null;
}
