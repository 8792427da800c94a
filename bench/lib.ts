/**
 * Shared by the benchmarks: a scratch database, the app on port 0, a bare-Express baseline in the same
 * run, and autocannon. Figures are reported as ratios against that baseline, never asserted by tests.
 */
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import pg from 'pg';

/** The benchmarks' own database on the test cluster (never the demo's); LOADLINE_DB_PORT picks the cluster. */
export const benchDatabaseUrl =
  process.env.BENCH_DATABASE_URL ?? `postgres://postgres@127.0.0.1:${process.env.LOADLINE_DB_PORT ?? '54339'}/loadline_bench`;

/** Creates the scratch database when missing; the app modules read DATABASE_URL when first imported, so this runs before them. */
export async function prepareDatabase(): Promise<void> {
  const url = new URL(benchDatabaseUrl);
  const name = url.pathname.slice(1);
  if (!name.endsWith('_bench')) throw new Error(`Refusing to benchmark against '${name}': the name must end in _bench.`);
  const admin = new pg.Client({ connectionString: Object.assign(new URL(benchDatabaseUrl), { pathname: '/postgres' }).toString() });
  await admin.connect();
  const exists = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
  if (!exists.rowCount) await admin.query(`CREATE DATABASE "${name}"`);
  await admin.end();
  process.env.DATABASE_URL = benchDatabaseUrl;
  process.env.NODE_ENV = 'test';
  process.env.LOG_LEVEL = 'silent';
  process.env.JWT_SECRET ??= 'bench-secret-bench-secret-bench-secret-0';
}

/** Brings the scratch schema up to date (the rate-limit counters live there) without touching its data. */
export async function migrateDatabase(): Promise<void> {
  const { AppDataSource } = await import('../server/db/data-source');
  if (!AppDataSource.isInitialized) await AppDataSource.initialize();
  await AppDataSource.runMigrations({ transaction: 'each' });
}

/** Drops and rebuilds the scratch schema from the migrations and seeds the demo. */
export async function freshDemoDatabase(): Promise<void> {
  const { AppDataSource } = await import('../server/db/data-source');
  const { seedDemo } = await import('../seeds/demo');
  if (!AppDataSource.isInitialized) await AppDataSource.initialize();
  await AppDataSource.query('DROP SCHEMA public CASCADE');
  await AppDataSource.query('CREATE SCHEMA public');
  await AppDataSource.runMigrations({ transaction: 'each' });
  await AppDataSource.transaction((em) => seedDemo(em));
}

export interface Running {
  url: string;
  /** The server's process, to read its CPU time. */
  pid: number;
  close(): Promise<void>;
}

/** Starts bench/serve.ts in a child process and waits for its port. */
function serve(mode: 'app' | 'baseline', overrides: Record<string, unknown> = {}): Promise<Running> {
  // BENCH_CPU_PROF=<dir> writes a CPU profile of the app's process, to see where its time goes.
  const prof = mode === 'app' && process.env.BENCH_CPU_PROF ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_CPU_PROF}`] : [];
  const child = spawn(process.execPath, [...prof, ...process.execArgv, fileURLToPath(new URL('./serve.ts', import.meta.url)), mode, JSON.stringify(overrides)], {
    // Served as in production (Express's production mode, no per-request debug work); the seed ran as test.
    env: { ...process.env, NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  return new Promise((resolve, reject) => {
    let out = '';
    child.once('exit', (code) => reject(new Error(`bench server (${mode}) exited with ${code}`)));
    child.stdout.on('data', (chunk: Buffer) => {
      out += chunk.toString();
      const port = /listening (\d+)/.exec(out)?.[1];
      if (!port) return;
      child.removeAllListeners('exit');
      resolve({
        url: `http://127.0.0.1:${port}`,
        pid: child.pid!,
        close: () => new Promise((r) => {
          child.once('exit', () => r());
          child.kill('SIGTERM');
        }),
      });
    });
  });
}

/** The whole Loadline app in its own process, with any config overrides (e.g. a raised rate limit). */
export function startApp(overrides: Record<string, unknown> = {}): Promise<Running> {
  return serve('app', overrides);
}

/** Bare Express parsing the same JSON body and answering a small JSON: the floor every route is compared with. */
export function startBaseline(): Promise<Running> {
  return serve('baseline');
}

export interface Measured {
  requestsPerSec: number;
  p99Ms: number;
  errors: number;
  non2xx: number;
}

export async function cannon(opts: { url: string; bodies: object[]; connections?: number; durationS?: number }): Promise<Measured> {
  let i = 0;
  const result = await autocannon({
    url: opts.url,
    connections: opts.connections ?? 50,
    duration: opts.durationS ?? 10,
    requests: [
      {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        // Cycles through the bodies so the run is not one request repeated.
        setupRequest: (req) => ({ ...req, body: JSON.stringify(opts.bodies[i++ % opts.bodies.length]) }),
      },
    ],
  });
  return { requestsPerSec: result.requests.average, p99Ms: result.latency.p99, errors: result.errors, non2xx: result.non2xx };
}

const median = (xs: number[]): number => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

/**
 * Measures the baseline and the route in alternating rounds (BENCH_ROUNDS, default 3) and reports each round
 * and the medians: on a shared VM the machine's speed drifts between runs, and a ratio taken within a round
 * cancels that drift where one long run of each would not.
 */
export async function compareWithBaseline(
  name: string,
  route: { url: string; bodies: object[] },
  opts: { connections?: number; durationS?: number; rounds?: number } = {},
): Promise<{ route: Measured; baseline: Measured; ratio: number; p99Ratio: number }> {
  const rounds = opts.rounds ?? Number(process.env.BENCH_ROUNDS ?? 3);
  const c = opts.connections ?? 50;
  const run = { connections: c, durationS: opts.durationS ?? 10 };
  const base = await startBaseline();
  try {
    // A short warm-up of each, so JIT and connection pools are ready before the measured runs.
    await cannon({ url: `${base.url}/baseline`, bodies: route.bodies, durationS: 2, connections: c });
    await cannon({ ...route, durationS: 2, connections: c });
    console.log(`\n${name} (${c} connections, ${run.durationS} s each, ${rounds} alternating rounds)`);
    const results: { baseline: Measured; route: Measured; ratio: number; p99Ratio: number }[] = [];
    for (let i = 0; i < rounds; i++) {
      const baseline = await cannon({ url: `${base.url}/baseline`, bodies: route.bodies, ...run });
      const measured = await cannon({ ...route, ...run });
      const ratio = measured.requestsPerSec / baseline.requestsPerSec;
      // A p99 of 0 ms (autocannon rounds to whole ms) counts as 1 ms, so the ratio stays finite.
      const p99Ratio = measured.p99Ms / Math.max(baseline.p99Ms, 1);
      results.push({ baseline, route: measured, ratio, p99Ratio });
      console.log(
        `  round ${i + 1}: bare express ${baseline.requestsPerSec.toFixed(0).padStart(6)} req/s p99 ${String(baseline.p99Ms).padStart(3)} ms | ` +
          `${name} ${measured.requestsPerSec.toFixed(0).padStart(6)} req/s p99 ${String(measured.p99Ms).padStart(3)} ms | ratio ${ratio.toFixed(3)}, p99 ${p99Ratio.toFixed(2)} x baseline` +
          (measured.errors || measured.non2xx ? ` | errors ${measured.errors}, non-2xx ${measured.non2xx}` : ''),
      );
    }
    const pick = (f: (r: (typeof results)[number]) => number) => median(results.map(f));
    const summary = {
      baseline: { requestsPerSec: pick((r) => r.baseline.requestsPerSec), p99Ms: pick((r) => r.baseline.p99Ms), errors: 0, non2xx: 0 },
      route: {
        requestsPerSec: pick((r) => r.route.requestsPerSec),
        p99Ms: pick((r) => r.route.p99Ms),
        errors: results.reduce((s, r) => s + r.route.errors, 0),
        non2xx: results.reduce((s, r) => s + r.route.non2xx, 0),
      },
      ratio: pick((r) => r.ratio),
      p99Ratio: pick((r) => r.p99Ratio),
    };
    console.log(`  median: bare express ${summary.baseline.requestsPerSec.toFixed(0)} req/s p99 ${summary.baseline.p99Ms} ms; ${name} ${summary.route.requestsPerSec.toFixed(0)} req/s p99 ${summary.route.p99Ms} ms; ratio ${summary.ratio.toFixed(3)}, p99 ${summary.p99Ratio.toFixed(2)} x baseline`);
    if (summary.route.errors || summary.route.non2xx) console.log(`  errors ${summary.route.errors}, non-2xx ${summary.route.non2xx} (the figures do not count)`);
    return summary;
  } finally {
    await base.close();
  }
}
