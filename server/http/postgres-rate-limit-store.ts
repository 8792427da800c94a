import { createHash } from 'node:crypto';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Pool } from 'pg';
import type { PostgresDriver } from 'typeorm/driver/postgres/PostgresDriver.js';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';

/** Runs one statement; `name` makes it a prepared statement on each pooled connection. */
export type Sql = (query: { name?: string; text: string; values: unknown[] }) => Promise<Record<string, unknown>[]>;

/** The app's own pool, so counting shares the connections (and their limit) of every other query. */
export const appSql: Sql = async (query) => {
  if (!AppDataSource.isInitialized) throw new AppError('unavailable', 'The service is briefly unavailable. Please try again in a moment.');
  const pool = (AppDataSource.driver as PostgresDriver).master as Pool;
  return (await pool.query(query)).rows as Record<string, unknown>[];
};

// Stored as a digest: any text (an e-mail with a NUL in it, say) becomes a short key, and the table holds no addresses or e-mails.
const stored = (key: string) => createHash('sha256').update(key).digest('base64url');
const sweepEveryMs = 60_000;
let lastSweep = 0;

// One statement counts every key waiting in this process; keys are sorted so two servers lock rows in one order.
const incrementSql = `
  INSERT INTO rate_limit_counters AS c (limiter, key, hits, reset_at)
  SELECT $1, t.key, t.n, now() + $4::int * interval '1 millisecond'
  FROM unnest($2::varchar[], $3::int[]) AS t(key, n)
  ORDER BY t.key
  ON CONFLICT (limiter, key) DO UPDATE SET
    hits = CASE WHEN c.reset_at <= now() THEN excluded.hits ELSE c.hits + excluded.hits END,
    reset_at = CASE WHEN c.reset_at <= now() THEN excluded.reset_at ELSE c.reset_at END
  RETURNING key, hits, reset_at`;

interface Waiter {
  resolve(info: ClientRateLimitInfo): void;
  reject(error: unknown): void;
}

/**
 * An express-rate-limit store whose counters live in PostgreSQL, so every app server on one database
 * enforces one limit. Each count is one atomic UPSERT … RETURNING; requests that arrive while a count
 * is in flight are added together in the next one (each still gets its own exact position in the
 * window), so a burst costs one round trip per batch rather than per request.
 */
export class PostgresRateLimitStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;
  private queued = new Map<string, Waiter[]>();
  private flushing = false;

  constructor(
    /** Names the limiter's counters, so two limiters never share a key. */
    readonly prefix: string,
    private readonly sql: Sql = appSql,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  increment(key: string): Promise<ClientRateLimitInfo> {
    const k = stored(key);
    return new Promise((resolve, reject) => {
      const waiting = this.queued.get(k);
      if (waiting) waiting.push({ resolve, reject });
      else this.queued.set(k, [{ resolve, reject }]);
      // Counted on the next turn of the event loop, so requests read in the same turn share one statement.
      if (!this.flushing) {
        this.flushing = true;
        setImmediate(() => void this.flush());
      }
    });
  }

  private async flush(): Promise<void> {
    try {
      while (this.queued.size) {
        const batch = this.queued;
        this.queued = new Map();
        const keys = [...batch.keys()];
        try {
          const rows = await this.sql({
            name: 'rate-limit-increment',
            text: incrementSql,
            values: [this.prefix, keys, keys.map((k) => batch.get(k)!.length), this.windowMs],
          });
          for (const row of rows) {
            const waiters = batch.get(row.key as string);
            batch.delete(row.key as string);
            const hits = row.hits as number;
            const resetTime = row.reset_at as Date;
            waiters?.forEach((w, i) => w.resolve({ totalHits: hits - waiters.length + 1 + i, resetTime }));
          }
          for (const waiters of batch.values()) for (const w of waiters) w.reject(new Error('rate-limit counter missing from the answer'));
        } catch (e) {
          for (const waiters of batch.values()) for (const w of waiters) w.reject(e);
        }
        if (Date.now() - lastSweep > sweepEveryMs) {
          lastSweep = Date.now();
          sweepExpiredCounters(this.sql).catch(() => (lastSweep = 0));
        }
      }
    } finally {
      this.flushing = false;
    }
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.sql({
      text: 'SELECT hits, reset_at FROM rate_limit_counters WHERE limiter = $1 AND key = $2 AND reset_at > now()',
      values: [this.prefix, stored(key)],
    });
    return row ? { totalHits: row.hits as number, resetTime: row.reset_at as Date } : undefined;
  }

  async decrement(key: string): Promise<void> {
    await this.sql({
      name: 'rate-limit-decrement',
      text: 'UPDATE rate_limit_counters SET hits = hits - 1 WHERE limiter = $1 AND key = $2 AND hits > 0 AND reset_at > now()',
      values: [this.prefix, stored(key)],
    });
  }

  async resetKey(key: string): Promise<void> {
    await this.sql({ text: 'DELETE FROM rate_limit_counters WHERE limiter = $1 AND key = $2', values: [this.prefix, stored(key)] });
  }

  async resetAll(): Promise<void> {
    await this.sql({ text: 'DELETE FROM rate_limit_counters WHERE limiter = $1', values: [this.prefix] });
  }
}

/** Deletes counters whose window has closed; any server may run it, and each does about once a minute. */
export async function sweepExpiredCounters(sql: Sql = appSql): Promise<number> {
  const rows = await sql({ text: 'DELETE FROM rate_limit_counters WHERE reset_at <= now() RETURNING 1', values: [] });
  return rows.length;
}
