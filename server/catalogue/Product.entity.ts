import { Column, CreateDateColumn, Entity, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn, type Relation } from 'typeorm';
import type { ProductKind, SpringEnd, SpringEndType } from '../../shared/catalogue';
import { ProductImage } from './ProductImage.entity';

/** Something the shop sells; the spring columns are set only for kind 'spring'. */
@Entity({ name: 'products' })
export class Product {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar', length: 40 })
  sku!: string;

  @Column({ type: 'varchar', length: 120 })
  name!: string;

  @Column({ type: 'varchar', length: 20 })
  kind!: ProductKind;

  @Column({ type: 'text', default: '' })
  description!: string;

  @Column({ name: 'price_cents', type: 'int' })
  priceCents!: number;

  @Column({ type: 'char', length: 3, default: 'EUR' })
  currency!: 'EUR';

  @Column({ name: 'stock_on_hand', type: 'int', default: 0 })
  stockOnHand!: number;

  @Column({ name: 'bin_location', type: 'varchar', length: 20, default: '' })
  binLocation!: string;

  @Column({ type: 'boolean', default: true })
  active!: boolean;

  // Null: the shop's default low-stock threshold applies.
  @Column({ name: 'low_stock_threshold', type: 'int', nullable: true })
  lowStockThreshold!: number | null;

  @Column({ name: 'spring_end', type: 'varchar', length: 10, nullable: true })
  springEnd!: SpringEnd | null;

  @Column({ name: 'rate_n_per_mm', type: 'double precision', nullable: true })
  rateNPerMm!: number | null;

  @Column({ name: 'free_length_mm', type: 'double precision', nullable: true })
  freeLengthMm!: number | null;

  @Column({ name: 'inner_diameter_mm', type: 'double precision', nullable: true })
  innerDiameterMm!: number | null;

  @Column({ name: 'outer_diameter_mm', type: 'double precision', nullable: true })
  outerDiameterMm!: number | null;

  @Column({ name: 'wire_diameter_mm', type: 'double precision', nullable: true })
  wireDiameterMm!: number | null;

  @Column({ name: 'total_coils', type: 'double precision', nullable: true })
  totalCoils!: number | null;

  @Column({ name: 'end_type', type: 'varchar', length: 20, nullable: true })
  endType!: SpringEndType | null;

  @Column({ type: 'varchar', length: 40, nullable: true })
  material!: string | null;

  // As stated by staff; null means the computed solid length stands.
  @Column({ name: 'solid_length_mm', type: 'double precision', nullable: true })
  solidLengthMm!: number | null;

  @Column({ name: 'computed_rate_n_per_mm', type: 'double precision', nullable: true })
  computedRateNPerMm!: number | null;

  @Column({ name: 'computed_solid_length_mm', type: 'double precision', nullable: true })
  computedSolidLengthMm!: number | null;

  @Column({ name: 'spring_index', type: 'double precision', nullable: true })
  springIndex!: number | null;

  @Column({ name: 'active_coils', type: 'double precision', nullable: true })
  activeCoils!: number | null;

  @OneToMany(() => ProductImage, (i) => i.product)
  images?: Relation<ProductImage>[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;
}
