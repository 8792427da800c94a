import type { EntityManager } from 'typeorm';
import type { AuditEntityType, AuditEntryDto, AuditListQueryDto, Page } from '../../shared/catalogue';
import { AppDataSource } from '../db/data-source';
import { AuditEntry } from './AuditEntry.entity';

export interface AuditInput {
  actorId: string | null;
  entityType: AuditEntityType;
  entityId: string;
  action: AuditEntry['action'];
  before: object | null;
  after: object | null;
}

// Snapshots go through JSON so Dates and class instances are stored as the plain values they show.
const plain = (o: object | null): Record<string, unknown> | null => (o === null ? null : (JSON.parse(JSON.stringify(o)) as Record<string, unknown>));

/** Writes audit rows in the caller's transaction, so a change and its record commit together. */
export async function recordAudit(em: EntityManager, ...entries: AuditInput[]): Promise<void> {
  if (!entries.length) return;
  const repo = em.getRepository(AuditEntry);
  const rows = entries.map((e) => repo.create({ ...e, before: plain(e.before), after: plain(e.after) }));
  // Chunked: an import of thousands of rows would exceed the bind-parameter limit in one insert.
  for (let i = 0; i < rows.length; i += 1000) await repo.insert(rows.slice(i, i + 1000));
}

export async function listAudit(q: AuditListQueryDto): Promise<Page<AuditEntryDto>> {
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 20;
  const qb = AppDataSource.getRepository(AuditEntry)
    .createQueryBuilder('a')
    .leftJoin('users', 'u', 'u.id = a.actor_id')
    .addSelect('u.email', 'actor_email')
    .orderBy('a.at', 'DESC')
    .addOrderBy('a.id', 'DESC');
  if (q.entityType) qb.andWhere('a.entity_type = :t', { t: q.entityType });
  if (q.entityId) qb.andWhere('a.entity_id = :id', { id: q.entityId });
  const total = await qb.getCount();
  const { entities, raw } = await qb.offset((page - 1) * pageSize).limit(pageSize).getRawAndEntities<{ actor_email: string | null }>();
  const items = entities.map((a, i) => ({
    id: a.id,
    at: a.at.toISOString(),
    actorId: a.actorId,
    actorEmail: raw[i]?.actor_email ?? null,
    entityType: a.entityType,
    entityId: a.entityId,
    action: a.action,
    before: a.before as Record<string, unknown> | null,
    after: a.after as Record<string, unknown> | null,
  }));
  return { items, total, page, pageSize };
}
