import autocannon from 'autocannon';
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { checkoutStages } from './checkout-stages';
import { cpuMeter, selfCpu, treeCpu } from './cpu';
import { benchDatabaseUrl, freshDemoDatabase, startApp } from './lib';

const buyers = Number(process.env.BENCH_BUYERS ?? 200);
const seconds = Number(process.env.BENCH_SECONDS ?? 8);
const rounds = Number(process.env.BENCH_ROUNDS ?? 3);
const pgbenchClients = 50;
const standinPort = Number(process.env.BENCH_STRIPE_API_PORT ?? 8472);

/** The database's own floor: pgbench running the checkout's guarded stock update, its ledger row and an order insert on the same hot row. */
function pgbenchFloor(productId: string): number {
  const dir = mkdtempSync(join(tmpdir(), 'loadline-pgbench-'));
  const script = join(dir, 'checkout.sql');
  writeFileSync(
    script,
    `BEGIN;
UPDATE products SET stock_on_hand = stock_on_hand - 1, updated_at = now() WHERE id = '${productId}' AND active AND stock_on_hand + -1 >= 0 RETURNING stock_on_hand;
INSERT INTO stock_movements (product_id, quantity, reason, note, stock_after) VALUES ('${productId}', -1, 'sale', '', 0);
INSERT INTO orders (email, customer_name, shipping_address, status, payment_status, fulfilment_status, currency, subtotal_cents, shipping_cents, vat_cents, total_cents, vat_rate_bp, reserved_until)
  VALUES ('floor@example.test', 'Floor', '{}', 'pending', 'awaiting', 'unfulfilled', 'EUR', 3900, 690, 765, 4590, 2000, now() + interval '30 minutes');
COMMIT;
`,
  );
  const url = new URL(benchDatabaseUrl);
  const bin = existsSync('/usr/lib/postgresql/15/bin/pgbench') ? '/usr/lib/postgresql/15/bin/pgbench' : 'pgbench';
  const r = spawnSync(bin, ['-n', '-h', url.hostname, '-p', url.port, '-U', url.username || 'postgres', '-c', String(pgbenchClients), '-j', '2', '-T', String(seconds), '-f', script, url.pathname.slice(1)], { encoding: 'utf8' });
  rmSync(dir, { recursive: true, force: true });
  const tps = /tps = ([\d.]+)/.exec(r.stdout)?.[1];
  if (!tps) throw new Error(`pgbench gave no tps:\n${r.stdout}\n${r.stderr}`);
  return Number(tps);
}

/** The payment stand-in in its own process, so the app's calls to it cross a real socket as in production. */
async function startStandin(): Promise<{ pid: number; stop(): Promise<void> }> {
  const runDir = mkdtempSync(join(tmpdir(), 'loadline-bench-run-'));
  const child = spawn(process.execPath, [...process.execArgv, fileURLToPath(new URL('../standins/payments/main.ts', import.meta.url))], {
    env: { ...process.env, STRIPE_API_PORT: String(standinPort), LOADLINE_RUN_DIR: runDir, PAYMENTS_WEBHOOK_URL: '' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  for (let i = 0; i < 100 && !existsSync(join(runDir, 'standins', 'payments.ready')); i++) await new Promise((r) => setTimeout(r, 100));
  return {
    pid: child.pid!,
    async stop() {
      await new Promise((r) => {
        child.once('exit', r);
        child.kill('SIGTERM');
      });
      rmSync(runDir, { recursive: true, force: true });
    },
  };
}

/** Where the database's postmaster runs, so its backends' CPU can be read. */
async function postmasterPid(): Promise<number> {
  const { AppDataSource } = await import('../server/db/data-source');
  const [{ setting }] = (await AppDataSource.query(`SELECT setting FROM pg_settings WHERE name = 'data_directory'`)) as [{ setting: string }];
  return Number(readFileSync(join(setting, 'postmaster.pid'), 'utf8').split('\n')[0]);
}

/**
 * 200 buyers checking out at once, each with a cart of one unit of the same hot product, for a few seconds, in
 * several rounds (BENCH_ROUNDS, default 3); each round measures pgbench's floor for the same stock update, ledger row
 * and order insert with 50 clients first. Prints orders/s, the ratio to the floor, p50/p99 of the checkout answers,
 * and the CPU each process spent per checkout. Targets: ratio ≥ 0.3, p99 < 1 s.
 */
export async function run(): Promise<void> {
  await freshDemoDatabase();
  const { AppDataSource } = await import('../server/db/data-source');
  const product = async (name: string) =>
    ((await AppDataSource.query(`INSERT INTO products (sku, name, kind, price_cents, stock_on_hand) VALUES ($1, $2, 'tool', 3900, 10000000) RETURNING id`, [`BENCH-${name}`, name])) as { id: string }[])[0]!.id;

  const floorProduct = await product('floor hot spring');
  const hot = await product('bench hot spring');
  // Enough carts that no buyer reuses one (a second checkout of a cart replaces the first, another path).
  const cartCount = rounds * seconds * 1200 + 1000;
  const carts = ((await AppDataSource.query(`INSERT INTO carts (user_id) SELECT NULL FROM generate_series(1, $1) RETURNING id`, [cartCount])) as { id: string }[]).map((c) => c.id);
  await AppDataSource.query(`INSERT INTO cart_lines (cart_id, product_id, quantity, unit_price_cents) SELECT unnest($1::uuid[]), $2, 1, 3900`, [carts, hot]);

  // The app is served as in production, which wants its payment keys named; these are the stand-in's.
  process.env.STRIPE_SECRET_KEY ??= 'sk_test_loadline_bench';
  process.env.STRIPE_WEBHOOK_SECRET ??= 'whsec_loadline_bench';
  process.env.STRIPE_API_PORT = String(standinPort);
  const standin = await startStandin();
  let app: Awaited<ReturnType<typeof startApp>> | undefined;
  try {
    app = await startApp({ stripeApiPort: standinPort, reservationSweepMs: 0, logLevel: 'silent' });
    const body = { email: 'buyer@example.test', shippingAddress: { name: 'Bench Buyer', line1: '1 Load St', postalCode: '10115', city: 'Eastbrook', country: 'DE' } };
    const text = JSON.stringify(body);
    let next = 0;
    const checkoutOnce = async (cart: string) => {
      const res = await fetch(`${app!.url}/api/checkout`, { method: 'POST', headers: { 'Content-Type': 'application/json', Cookie: `loadline_cart=${cart}` }, body: text });
      await res.arrayBuffer();
      if (res.status !== 201) throw new Error(`warm-up checkout answered ${res.status}`);
    };
    // Warm-up: JIT, pools and the stand-in's sockets ready before anything is measured.
    await Promise.all(Array.from({ length: 50 }, () => checkoutOnce(carts[next++]!)));
    const alone: number[] = [];
    for (let i = 0; i < 10; i++) {
      const t0 = performance.now();
      await checkoutOnce(carts[next++]!);
      alone.push(performance.now() - t0);
    }
    const pgPid = await postmasterPid();
    console.log(`\ncheckout: ${buyers} concurrent buyers for ${seconds} s on one hot product, ${rounds} rounds; pgbench floor with ${pgbenchClients} clients for ${seconds} s before each`);
    console.log(`  one buyer alone: ${[...alone].sort((a, b) => a - b)[5]!.toFixed(1)} ms per checkout (median of 10)`);
    const results: { floor: number; ordersPerSec: number; p50: number; p99: number }[] = [];
    for (let round = 1; round <= rounds; round++) {
      const floorMeter = cpuMeter({ postgres: treeCpu(pgPid) });
      const floor = pgbenchFloor(floorProduct);
      const floorCpu = floorMeter.read().postgres! / (floor * seconds);
      const meter = cpuMeter({ generator: selfCpu(process.pid), app: treeCpu(app.pid), 'payment stand-in': treeCpu(standin.pid), postgres: treeCpu(pgPid) });
      // autocannon keeps one request in flight per connection: each connection is one buyer, each request its own cart.
      const r = await autocannon({
        url: `${app.url}/api/checkout`,
        connections: buyers,
        duration: seconds,
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: text,
        requests: [{ setupRequest: (req) => ({ ...req, headers: { ...req.headers, cookie: `loadline_cart=${carts[next++ % carts.length]}` } }) }],
      });
      const cpu = meter.read();
      // Checkouts autocannon gave up on at the end still run in the app; one more through the same queue waits them out.
      await checkoutOnce(carts[next++ % carts.length]!);
      const orders = r['2xx'];
      const ordersPerSec = orders / r.duration;
      results.push({ floor, ordersPerSec, p50: r.latency.p50, p99: r.latency.p99 });
      console.log(
        `  round ${round}: floor ${floor.toFixed(0)} tps | app ${ordersPerSec.toFixed(0)} orders/s (${orders} orders${r.non2xx || r.errors ? `, ${r.non2xx} non-2xx, ${r.errors} errors` : ''}) | ` +
          `ratio ${(ordersPerSec / floor).toFixed(3)} | p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms`,
      );
      console.log(`           CPU per checkout: ${Object.entries(cpu).map(([k, ms]) => `${k} ${((ms * 1000) / Math.max(orders, 1)).toFixed(0)} µs`).join(', ')}; postgres per floor transaction ${(floorCpu * 1000).toFixed(0)} µs`);
    }
    const med = (f: (x: (typeof results)[number]) => number) => [...results.map(f)].sort((a, b) => a - b)[Math.floor(results.length / 2)]!;
    console.log(`  median of rounds: floor ${med((x) => x.floor).toFixed(0)} tps, ${med((x) => x.ordersPerSec).toFixed(0)} orders/s, ratio ${med((x) => x.ordersPerSec / x.floor).toFixed(3)} (target ≥ 0.3), p50 ${med((x) => x.p50)} ms, p99 ${med((x) => x.p99)} ms (target < 1000 ms)`);
    await checkoutStages({ appUrl: app.url, carts: carts.slice(cartCount - 200), body });
  } finally {
    await app?.close();
    await standin.stop();
  }
}
