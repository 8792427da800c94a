import { Column, CreateDateColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/**
 * The columns an order and an exchange both keep: a number the database gives, the buyer's e-mail, the payment page
 * and the payment made on it, and when the row was made, changed and shipped.
 */
export abstract class PaidRecordColumns {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  // Given by the database from the table's own sequence (LL-1001, EX-1001, …).
  @Column({ type: 'varchar', length: 20, insert: false, update: false })
  number!: string;

  @Column({ type: 'varchar', length: 254 })
  email!: string;

  @Column({ name: 'payment_session_id', type: 'varchar', length: 255, nullable: true })
  paymentSessionId!: string | null;

  @Column({ name: 'payment_url', type: 'text', nullable: true })
  paymentUrl!: string | null;

  @Column({ name: 'payment_intent_id', type: 'varchar', length: 255, nullable: true })
  paymentIntentId!: string | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt!: Date;

  @Column({ name: 'shipped_at', type: 'timestamptz', nullable: true })
  shippedAt!: Date | null;
}
