import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { AuditEntityType } from '../../shared/catalogue';

/** Who changed what, when, with the record before and after. */
@Entity({ name: 'audit_log' })
export class AuditEntry {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'timestamptz', default: () => 'clock_timestamp()' })
  at!: Date;

  @Column({ name: 'actor_id', type: 'uuid', nullable: true })
  actorId!: string | null;

  @Column({ name: 'entity_type', type: 'varchar', length: 20 })
  entityType!: AuditEntityType;

  @Column({ name: 'entity_id', type: 'uuid' })
  entityId!: string;

  @Column({ type: 'varchar', length: 10 })
  action!: 'create' | 'update' | 'delete' | 'import';

  @Column({ type: 'jsonb', nullable: true })
  before!: object | null;

  @Column({ type: 'jsonb', nullable: true })
  after!: object | null;
}
