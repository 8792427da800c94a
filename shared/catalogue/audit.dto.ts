import { IsIn, IsOptional, IsUUID } from 'class-validator';
import { auditEntityTypes, PageQueryDto, type AuditEntityType } from './common';

export { auditEntityTypes, type AuditEntityType } from './constants';

export interface AuditEntryDto {
  id: string;
  at: string;
  actorId: string | null;
  actorEmail: string | null;
  entityType: AuditEntityType;
  entityId: string;
  action: 'create' | 'update' | 'delete' | 'import';
  /** The record's fields before and after; null on create (before) and delete (after). */
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
}

/** GET /api/staff/audit query; newest first. */
export class AuditListQueryDto extends PageQueryDto {
  @IsOptional()
  @IsIn(auditEntityTypes as unknown as string[], { message: `Entity type is one of ${auditEntityTypes.join(', ')}.` })
  entityType?: AuditEntityType;

  @IsOptional()
  @IsUUID('all', { message: 'Entity id is a UUID.' })
  entityId?: string;
}
