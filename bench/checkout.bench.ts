import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { benchDatabaseUrl, freshDemoDatabase, startApp } from './lib';

const buyers = Number(process.env.BENCH_BUYERS ?? 200);
const seconds = Number(process.env.BENCH_SECONDS ?? 8);
const pgbenchClients = 50;
const standinPort = Number(process.env.BENCH_STRIPE_API_PORT ?? 8472);

const pct = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN;

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
async function startStandin(): Promise<() => Promise<void>> {
  const runDir = mkdtempSync(join(tmpdir(), 'loadline-bench-run-'));
  const child = spawn(process.execPath, [...process.execArgv, fileURLToPath(new URL('../standins/payments/main.ts', import.meta.url))], {
    env: { ...process.env, STRIPE_API_PORT: String(standinPort), LOADLINE_RUN_DIR: runDir, PAYMENTS_WEBHOOK_URL: '' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  for (let i = 0; i < 100 && !existsSync(join(runDir, 'standins', 'payments.ready')); i++) await new Promise((r) => setTimeout(r, 100));
  return async () => {
    await new Promise((r) => {
      child.once('exit', r);
      child.kill('SIGTERM');
    });
    rmSync(runDir, { recursive: true, force: true });
  };
}

/**
 * 200 buyers checking out at once, each with a cart of one unit of the same hot product, for a few seconds; beside
 * it, pgbench's floor for the same stock update and order insert with 50 clients. Prints orders/s, the ratio to the
 * floor and p50/p99 of the checkout answers. Targets: ratio ≥ 0.3, p99 < 1 s.
 */
export async function run(): Promise<void> {
  await freshDemoDatabase();
  const { AppDataSource } = await import('../server/db/data-source');
  const product = async (name: string) =>
    ((await AppDataSource.query(`INSERT INTO products (sku, name, kind, price_cents, stock_on_hand) VALUES ($1, $2, 'tool', 3900, 10000000) RETURNING id`, [`BENCH-${name}`, name])) as { id: string }[])[0]!.id;

  const floorProduct = await product('floor hot spring');
  const floor = pgbenchFloor(floorProduct);

  const hot = await product('bench hot spring');
  const cartCount = Math.max(buyers * 40, 4000);
  const carts = ((await AppDataSource.query(`INSERT INTO carts (user_id) SELECT NULL FROM generate_series(1, $1) RETURNING id`, [cartCount])) as { id: string }[]).map((c) => c.id);
  await AppDataSource.query(`INSERT INTO cart_lines (cart_id, product_id, quantity, unit_price_cents) SELECT unnest($1::uuid[]), $2, 1, 3900`, [carts, hot]);

  // The app is served as in production, which wants its payment keys named; these are the stand-in's.
  process.env.STRIPE_SECRET_KEY ??= 'sk_test_loadline_bench';
  process.env.STRIPE_WEBHOOK_SECRET ??= 'whsec_loadline_bench';
  process.env.STRIPE_API_PORT = String(standinPort);
  const stopStandin = await startStandin();
  let app: Awaited<ReturnType<typeof startApp>> | undefined;
  try {
    app = await startApp({ stripeApiPort: standinPort, reservationSweepMs: 0, logLevel: 'silent' });
    const body = JSON.stringify({ email: 'buyer@example.test', shippingAddress: { name: 'Bench Buyer', line1: '1 Load St', postalCode: '10115', city: 'Eastbrook', country: 'DE' } });
    let next = 0;
    const latencies: number[] = [];
    let failures = 0;
    const failedWith = new Map<string, number>();
    const checkoutOnce = async (cart: string) => {
      const t0 = performance.now();
      const res = await fetch(`${app!.url}/api/checkout`, { method: 'POST', headers: { 'Content-Type': 'application/json', Cookie: `loadline_cart=${cart}` }, body });
      await res.arrayBuffer();
      if (res.status === 201) latencies.push(performance.now() - t0);
      else {
        failures += 1;
        const key = `${res.status}`;
        failedWith.set(key, (failedWith.get(key) ?? 0) + 1);
      }
    };
    // Warm-up: a few checkouts so JIT, pools and the stand-in are ready.
    await Promise.all(Array.from({ length: 20 }, () => checkoutOnce(carts[next++]!)));
    // One buyer alone, for the floor of a checkout's own latency on this machine.
    const alone: number[] = [];
    for (let i = 0; i < 10; i++) {
      const t0 = performance.now();
      await checkoutOnce(carts[next++]!);
      alone.push(performance.now() - t0);
    }
    latencies.length = 0;
    failures = 0;
    failedWith.clear();
    const until = performance.now() + seconds * 1000;
    const start = performance.now();
    await Promise.all(
      Array.from({ length: buyers }, async () => {
        while (performance.now() < until && next < carts.length) await checkoutOnce(carts[next++]!);
      }),
    );
    const elapsed = (performance.now() - start) / 1000;
    const sorted = [...latencies].sort((a, b) => a - b);
    const ordersPerSec = latencies.length / elapsed;
    console.log(`\ncheckout: ${buyers} concurrent buyers for ${seconds} s on one hot product; pgbench floor with ${pgbenchClients} clients for ${seconds} s`);
    console.log(`  pgbench floor (guarded update + order insert): ${floor.toFixed(0)} tps`);
    console.log(`  checkout through the app and the payment stand-in: ${ordersPerSec.toFixed(0)} orders/s (${latencies.length} orders, ${failures} failed)`);
    if (failures) console.log(`  failed answers by status: ${JSON.stringify(Object.fromEntries(failedWith))}`);
    console.log(`  one buyer alone: ${[...alone].sort((a, b) => a - b)[5]!.toFixed(0)} ms per checkout (median of 10)`);
    console.log(`  ratio to the floor: ${(ordersPerSec / floor).toFixed(3)} (target ≥ 0.3)`);
    console.log(`  latency p50 ${pct(sorted, 50).toFixed(0)} ms, p99 ${pct(sorted, 99).toFixed(0)} ms (target p99 < 1000 ms)`);
  } finally {
    await app?.close();
    await stopStandin();
  }
}
