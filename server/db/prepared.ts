import type { Pool, PoolClient, QueryResultRow } from 'pg';
import type { EntityManager } from 'typeorm';
import type { PostgresDriver } from 'typeorm/driver/postgres/PostgresDriver.js';
import type { PostgresQueryRunner } from 'typeorm/driver/postgres/PostgresQueryRunner.js';

/**
 * A hot statement as a named prepared statement: each pooled connection parses and plans it once, not on every call.
 * Runs in the manager's transaction when it has one, else on a pooled connection. One name, one text, always.
 */
export async function preparedQuery<T extends QueryResultRow>(em: EntityManager, name: string, text: string, values: unknown[]): Promise<T[]> {
  const runner = em.queryRunner as PostgresQueryRunner | undefined;
  const on: Pool | PoolClient = runner ? ((await runner.connect()) as PoolClient) : ((em.connection.driver as PostgresDriver).master as Pool);
  return (await on.query<T>({ name, text, values })).rows;
}
