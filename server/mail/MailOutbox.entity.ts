import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A mail Loadline has promised to send, written in the same transaction as the change it tells about. */
@Entity({ name: 'mail_outbox' })
export class MailOutbox {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  // Names the event the mail tells about (e.g. "order-confirmed:<id>"), so a second enqueue of one event is a no-op.
  @Column({ name: 'dedupe_key', type: 'varchar', length: 200 })
  dedupeKey!: string;

  @Column({ name: 'recipient', type: 'varchar', length: 254 })
  to!: string;

  @Column({ type: 'varchar', length: 300 })
  subject!: string;

  @Column({ name: 'text_body', type: 'text' })
  text!: string;

  @Column({ name: 'html_body', type: 'text' })
  html!: string;

  @Column({ type: 'int', default: 0 })
  attempts!: number;

  @Column({ name: 'last_error', type: 'text', nullable: true })
  lastError!: string | null;

  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true })
  sentAt!: Date | null;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
