import { AppDataSource } from '../db/data-source';

// Counted in memory and added to the table in one upsert every few seconds, so serving a recommendation never
// waits on a write; several servers each add their own counts. A crash loses at most one interval's count.
const flushEveryMs = 5_000;
const pending = new Map<string, number>();
let timer: NodeJS.Timeout | undefined;

const today = () => new Date().toISOString().slice(0, 10);

/** Notes one recommendation answer served today (UTC day, like the dashboard's). */
export function countRecommendationServed(): void {
  const day = today();
  pending.set(day, (pending.get(day) ?? 0) + 1);
  if (!timer) {
    timer = setInterval(() => void flushRecommendationCounts().catch(() => undefined), flushEveryMs);
    timer.unref();
  }
}

/** Writes the counts kept so far; on failure they are kept for the next try. */
export async function flushRecommendationCounts(): Promise<void> {
  if (!pending.size) return;
  const rows = [...pending.entries()];
  pending.clear();
  try {
    await AppDataSource.query(
      `INSERT INTO recommendation_counts (day, served)
       SELECT * FROM unnest($1::date[], $2::int[])
       ON CONFLICT (day) DO UPDATE SET served = recommendation_counts.served + EXCLUDED.served`,
      [rows.map(([d]) => d), rows.map(([, n]) => n)],
    );
  } catch (e) {
    for (const [d, n] of rows) pending.set(d, (pending.get(d) ?? 0) + n);
    throw e;
  }
}
