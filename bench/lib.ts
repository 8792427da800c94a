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

/** Measures the route and the baseline in the same run and prints req/s, p99 and the ratio. */
export async function compareWithBaseline(name: string, route: { url: string; bodies: object[] }, opts: { connections?: number; durationS?: number } = {}): Promise<{ route: Measured; baseline: Measured; ratio: number }> {
  const base = await startBaseline();
  try {
    // A short warm-up of each, so JIT and connection pools are ready before the measured runs.
    await cannon({ url: `${base.url}/baseline`, bodies: route.bodies, durationS: 2, connections: opts.connections });
    await cannon({ ...route, durationS: 2, connections: opts.connections });
    const baseline = await cannon({ url: `${base.url}/baseline`, bodies: route.bodies, ...opts });
    const measured = await cannon({ ...route, ...opts });
    const ratio = measured.requestsPerSec / baseline.requestsPerSec;
    const c = opts.connections ?? 50;
    console.log(`\n${name} (${c} connections, ${opts.durationS ?? 10} s each)`);
    console.log(`  bare express   ${baseline.requestsPerSec.toFixed(0).padStart(7)} req/s   p99 ${String(baseline.p99Ms).padStart(4)} ms`);
    console.log(`  ${name.padEnd(14)} ${measured.requestsPerSec.toFixed(0).padStart(7)} req/s   p99 ${String(measured.p99Ms).padStart(4)} ms   errors ${measured.errors}, non-2xx ${measured.non2xx}`);
    console.log(`  ratio ${ratio.toFixed(3)}`);
    return { route: measured, baseline, ratio };
  } finally {
    await base.close();
  }
}
