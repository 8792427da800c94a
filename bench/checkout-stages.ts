/**
 * Where one checkout's time goes, measured one buyer at a time: the HTTP path and request check of the app (a refused
 * body answers before the service runs), each SQL round trip of the checkout (timed at the database client), and the
 * payment SDK's call to the stand-in. Medians in µs; the CPU per checkout of each process comes from the rush itself.
 */
import pg from 'pg';
import { performance } from 'node:perf_hooks';

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;

// The checkout's statements by what they do; anything else by its first words.
const labels: [RegExp, string][] = [
  [/^START TRANSACTION/i, 'BEGIN'],
  [/^WITH c AS/, 'cart and lines read'],
  [/^WITH cart AS/, 'order + lines + stock + ledger, cart checked (one statement, commits itself)'],
  [/^COMMIT/i, 'COMMIT'],
  [/^UPDATE orders SET payment_session_id/, 'payment page saved on the order'],
];
const labelOf = (sql: string) => labels.find(([re]) => re.test(sql.trim()))?.[1] ?? sql.trim().slice(0, 40);

/** Times every query the pg client sends in this process while `fn` runs, by label. */
async function timingQueries(fn: () => Promise<void>): Promise<Map<string, number[]>> {
  const times = new Map<string, number[]>();
  const proto = pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown };
  const original = proto.query;
  proto.query = function (this: unknown, ...args: unknown[]) {
    const t0 = performance.now();
    const sql = typeof args[0] === 'string' ? args[0] : String((args[0] as { text?: string } | undefined)?.text ?? '');
    const done = () => {
      const k = labelOf(sql);
      times.set(k, [...(times.get(k) ?? []), (performance.now() - t0) * 1000]);
    };
    // The pool (prepared statements run on it) hands the client a callback; TypeORM awaits the promise.
    const last = args.length - 1;
    const callback = args[last];
    if (typeof callback === 'function') {
      args[last] = (err: unknown, res: unknown) => {
        if (!err) done();
        (callback as (e: unknown, r: unknown) => void)(err, res);
      };
    }
    const out = original.apply(this, args);
    if (out && typeof (out as Promise<unknown>).then === 'function') (out as Promise<unknown>).then(done, () => undefined);
    return out;
  };
  try {
    await fn();
  } finally {
    proto.query = original;
  }
  return times;
}

export async function checkoutStages(opts: { appUrl: string; carts: string[]; body: object }): Promise<void> {
  const { parseConfig } = await import('../server/config');
  const { checkout } = await import('../server/checkout/checkout.service');
  const { paymentProviderFor } = await import('../server/payments/stripe-provider');
  const config = parseConfig(process.env);
  const provider = paymentProviderFor(config);
  const n = 40;

  // HTTP, the app's middleware and the request check: a body without an e-mail is refused before the service runs.
  const refused: number[] = [];
  for (let i = 0; i < n * 2; i++) {
    const t0 = performance.now();
    const res = await fetch(`${opts.appUrl}/api/checkout`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: '{}' });
    await res.arrayBuffer();
    refused.push((performance.now() - t0) * 1000);
  }

  // The payment SDK creating a session on the stand-in over a kept-alive socket.
  const sdk: number[] = [];
  const whole: number[] = [];
  const timed = {
    ...provider,
    createCheckoutSession: async (...args: Parameters<typeof provider.createCheckoutSession>) => {
      const t0 = performance.now();
      try {
        return await provider.createCheckoutSession(...args);
      } finally {
        sdk.push((performance.now() - t0) * 1000);
      }
    },
  };
  let next = 0;
  const sql = await timingQueries(async () => {
    for (let i = 0; i < n; i++) {
      const t0 = performance.now();
      await checkout(config, timed, { userId: null, guestCartId: opts.carts[next++]! }, opts.body as never);
      whole.push((performance.now() - t0) * 1000);
    }
  });

  const us = (x: number) => `${x.toFixed(0)} µs`;
  console.log(`\n  one checkout, one buyer at a time (median of ${n}, in process unless named):`);
  console.log(`    HTTP + middleware + request check (refused body, through the app's socket): ${us(median(refused))}`);
  for (const [k, v] of sql) console.log(`    SQL ${k}: ${us(median(v))}${v.length !== n ? ` (${v.length} calls)` : ''}`);
  console.log(`    payment SDK → stand-in, create the session: ${us(median(sdk))}`);
  console.log(`    whole checkout service (the above without HTTP): ${us(median(whole))}`);
}
