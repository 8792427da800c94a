/**
 * npm run bench -- pages: the first load of each rider page, as a new visitor with a cold cache gets it, in Debian's
 * Chromium with the CPU slowed 4× (CDP Emulation.setCPUThrottlingRate): the JavaScript bytes sent over the wire
 * (the compressed bodies, PerformanceResourceTiming.encodedBodySize, with the total including each response's headers
 * beside it) and the largest contentful paint (PerformanceObserver); CDP Network events show each script's encoding.
 *
 * The floor, measured in the same run and served by the same server code: a bare Vue 3 + PrimeVue page
 * (bench/pages-floor/) built with the app's own Vite config and compression, with the same preset and options,
 * Inter and the icons, mounting once each PrimeVue component the storefront's shell, landing page and spring
 * finder import (Toast, Drawer, Button, Message, Select, SelectButton, RadioButton, InputText, InputGroup,
 * InputGroupAddon, Tag) plus the toast and confirmation services. No router, store, API client, engine, units or charts:
 * those are what a page adds over the floor.
 *
 * Targets: each page's JS bytes ≤ 1.3 × the floor's; LCP < 1.0 s for the landing page and the finder.
 * BENCH_ROUNDS (default 3) rounds, each measuring the floor then every page; BENCH_BUILD=0 skips the client build;
 * BENCH_PAGES=landing,finder measures only the pages named; BENCH_LIST_SCRIPTS=1 lists each script a page loads.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { freshDemoDatabase, startApp, type Running } from './lib';

const root = fileURLToPath(new URL('..', import.meta.url));
const rounds = Number(process.env.BENCH_ROUNDS ?? 3);
const cpuSlowdown = 4;
const bytesTarget = 1.3;
const lcpTargetMs = 1000;
/** How long the network stays quiet before a load counts as done (Playwright's networkidle uses the same). */
const quietMs = 500;

interface Figures {
  /** Compressed script bodies: what the targets judge. */
  jsBytes: number;
  /** The same with each response's headers, which every extra chunk adds (about 0.9 kB each here). */
  wireBytes: number;
  scripts: number;
  lcpMs: number;
  /** Content-Encoding of each script response, to see the build's brotli files are the ones sent. */
  encodings: Set<string>;
}

interface PageCase {
  name: string;
  path: string;
  /** Signed in as the demo rider. */
  rider?: boolean;
  /** With the guest cart that holds a spring. */
  cart?: boolean;
  /** The finder's plan, as the page keeps it in localStorage. */
  plan?: object;
  /** What the visitor sees when the page has loaded. */
  ready: (page: Page) => Promise<unknown>;
}

// The bench process runs as NODE_ENV=test for the seed; a build under it would ship Vue's development bundle.
const productionBuild = { ...process.env, NODE_ENV: 'production' };

/** The client as `npm start` builds it: rebuilt only when its sources changed since the last build. */
function buildClient(): void {
  if (process.env.BENCH_BUILD === '0') return;
  const r = spawnSync('bash', ['-c', 'source scripts/lib.sh && ensure_client_build'], { cwd: root, stdio: 'inherit', env: productionBuild });
  if (r.status !== 0) throw new Error('the client build failed');
}

/** The floor page, built afresh with the app's Vite config (same plugins and precompression) into a scratch folder. */
function buildFloor(outDir: string): void {
  const r = spawnSync('npx', ['vite', 'build', 'bench/pages-floor', '--config', 'vite.config.ts', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'], {
    cwd: root,
    stdio: 'inherit',
    env: productionBuild,
  });
  if (r.status !== 0) throw new Error('the floor build failed');
}

async function json<T>(url: string, init: RequestInit = {}): Promise<{ body: T; cookie: string | null }> {
  const res = await fetch(url, { ...init, headers: { 'content-type': 'application/json', ...init.headers } });
  if (!res.ok) throw new Error(`${init.method ?? 'GET'} ${url}: ${res.status} ${await res.text()}`);
  return { body: (await res.json()) as T, cookie: res.headers.get('set-cookie') };
}

/** name=value of the first cookie in a Set-Cookie header. */
function cookiePair(header: string | null): { name: string; value: string } {
  const first = header?.split(';')[0];
  const eq = first?.indexOf('=') ?? -1;
  if (!first || eq < 0) throw new Error('the server set no cookie');
  return { name: first.slice(0, eq), value: first.slice(eq + 1) };
}

/** What the pages need from the demo shop: a bike, its springs, a product, a signed-in rider and a guest cart. */
async function demoVisit(base: string) {
  const makes = await json<{ id: string }[] | { items: { id: string }[] }>(`${base}/api/fitments`);
  const fitments = Array.isArray(makes.body) ? makes.body : makes.body.items;
  const fitmentId = fitments[0]!.id;
  const load = { fitmentId, ridingStyle: 'road', rider: { massKg: 95, gearKg: 8 }, luggage: [] };
  const rec = await json<{ fork: { candidates: { id: string }[] }; shock: { candidates: { id: string }[] } }>(`${base}/api/recommendations`, {
    method: 'POST',
    body: JSON.stringify(load),
  });
  const forkId = rec.body.fork.candidates[0]!.id;
  const shockId = rec.body.shock.candidates[0]!.id;
  const products = await json<{ items: { id: string }[] } | { id: string }[]>(`${base}/api/products`);
  const productId = (Array.isArray(products.body) ? products.body : products.body.items)[0]!.id;
  const signIn = await json(`${base}/api/auth/login`, { method: 'POST', body: JSON.stringify({ email: 'rider@demo.test', password: 'loadline-demo' }) });
  const cart = await json(`${base}/api/cart/lines`, { method: 'POST', body: JSON.stringify({ productId: forkId, quantity: 1 }) });
  return { fitmentId, forkId, shockId, productId, riderCookie: cookiePair(signIn.cookie), cartCookie: cookiePair(cart.cookie) };
}

function pageCases(v: Awaited<ReturnType<typeof demoVisit>>): PageCase[] {
  const heading = (page: Page) => page.getByRole('heading', { level: 1 }).first().waitFor();
  const sheet = new URLSearchParams({ fitmentId: v.fitmentId, ridingStyle: 'road', riderKg: '95', gearKg: '8', forkId: v.forkId, shockId: v.shockId });
  const plan = { fitmentId: v.fitmentId, ridingStyle: 'road', riderKg: 95, gearKg: 8, luggageKg: {}, cases: [] };
  return [
    { name: 'landing', path: '/', ready: heading },
    { name: 'finder', path: '/find', ready: heading },
    // The results' first paint is the chart's text alternative; chart.js follows when the plot nears the view (counted if it does).
    { name: 'finder, results', path: '/find', plan, ready: (p) => p.getByTestId('fork-springs-chart-summary').waitFor() },
    { name: 'product list', path: '/parts', ready: heading },
    { name: 'product page', path: `/parts/${v.productId}`, ready: heading },
    { name: 'cart', path: '/cart', cart: true, ready: heading },
    { name: 'checkout', path: '/checkout', cart: true, ready: heading },
    { name: 'sag check', path: '/sag-check', ready: heading },
    { name: 'my bikes', path: '/bikes', rider: true, ready: heading },
    { name: 'setup sheet', path: `/setup-sheet?${sheet}`, ready: heading },
    { name: 'sign-in', path: '/sign-in', ready: heading },
    { name: 'registration', path: '/register', ready: heading },
    { name: 'orders', path: '/orders', rider: true, ready: heading },
  ];
}

// Runs in the page before its own scripts: keeps the latest largest-contentful-paint candidate.
const observeLcp = `
  window.__lcp = 0;
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) window.__lcp = e.startTime;
  }).observe({ type: 'largest-contentful-paint', buffered: true });
`;

/** One first load in a fresh context (empty cache and storage). */
async function measure(browser: Browser, url: string, c: Partial<PageCase> & { ready: PageCase['ready'] }, cookies: { rider: { name: string; value: string }; cart: { name: string; value: string } } | null): Promise<Figures> {
  const context: BrowserContext = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  try {
    if (cookies && c.rider) await context.addCookies([{ ...cookies.rider, url }]);
    if (cookies && c.cart) await context.addCookies([{ ...cookies.cart, url }]);
    if (c.plan) await context.addInitScript(`localStorage.setItem('loadline.plan', ${JSON.stringify(JSON.stringify(c.plan))});`);
    await context.addInitScript(observeLcp);
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: cpuSlowdown });
    const scripts = new Map<string, string>();
    const urls = new Map<string, string>();
    const figures: Figures = { jsBytes: 0, wireBytes: 0, scripts: 0, lcpMs: 0, encodings: new Set() };
    const inflight = new Set<string>();
    let lastActivity = Date.now();
    cdp.on('Network.requestWillBeSent', (e) => {
      inflight.add(e.requestId);
      lastActivity = Date.now();
    });
    const settled = (e: { requestId: string }) => {
      inflight.delete(e.requestId);
      lastActivity = Date.now();
    };
    cdp.on('Network.loadingFailed', settled);
    cdp.on('Network.responseReceived', (e) => {
      if (e.type !== 'Script') return;
      const headers = Object.fromEntries(Object.entries(e.response.headers).map(([k, val]) => [k.toLowerCase(), String(val)]));
      scripts.set(e.requestId, headers['content-encoding'] ?? 'identity');
      urls.set(e.requestId, e.response.url);
    });
    cdp.on('Network.loadingFinished', (e) => {
      settled(e);
      const encoding = scripts.get(e.requestId);
      if (encoding === undefined) return;
      figures.scripts += 1;
      figures.encodings.add(encoding);
      // BENCH_LIST_SCRIPTS=1 names each script and its bytes on the wire, to see what a page pulls in.
      if (process.env.BENCH_LIST_SCRIPTS) console.log(`      ${c.path ?? '/'} ${urls.get(e.requestId)?.replace(/^.*\/assets\//, '')} ${e.encodedDataLength} ${encoding}`);
    });
    await page.goto(url + (c.path ?? '/'), { waitUntil: 'load' });
    await c.ready(page);
    // Late chunks (a chart, a lazily registered component) count: wait until the network is quiet.
    const deadline = Date.now() + 30_000;
    while (inflight.size || Date.now() - lastActivity < quietMs) {
      if (Date.now() > deadline) throw new Error(`${c.path ?? '/'}: the network never went quiet`);
      await new Promise((r) => setTimeout(r, 50));
    }
    figures.lcpMs = (await page.evaluate('window.__lcp')) as number;
    // Compressed body bytes of every script, and the same with each response's headers (the page's resource timings).
    const sizes = (await page.evaluate(`performance.getEntriesByType('resource')
      .filter((r) => new URL(r.name).pathname.endsWith('.js'))
      .map((r) => [r.encodedBodySize, r.transferSize])`)) as [number, number][];
    figures.jsBytes = sizes.reduce((sum, [body]) => sum + body, 0);
    figures.wireBytes = sizes.reduce((sum, [, wire]) => sum + wire, 0);
    return figures;
  } finally {
    await context.close();
  }
}

const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const kB = (b: number) => `${(b / 1000).toFixed(1).padStart(6)} kB`;
const ms = (t: number) => `${t.toFixed(0).padStart(5)} ms`;

export async function run(): Promise<void> {
  buildClient();
  const floorDir = mkdtempSync(join(tmpdir(), 'loadline-pages-floor-'));
  let app: Running | undefined;
  let floor: Running | undefined;
  let browser: Browser | undefined;
  try {
    buildFloor(floorDir);
    await freshDemoDatabase();
    // Served as in production; plain-http cookies so the signed-in pages can be measured over loopback.
    process.env.STRIPE_SECRET_KEY ??= 'sk_test_loadline_bench';
    process.env.STRIPE_WEBHOOK_SECRET ??= 'whsec_loadline_bench';
    const quiet = { secureCookies: false, mailWorker: false, reservationSweepMs: 0 };
    app = await startApp(quiet);
    floor = await startApp({ ...quiet, clientDist: floorDir });
    const visit = await demoVisit(app.url);
    // BENCH_PAGES=landing,finder measures only those pages.
    const only = process.env.BENCH_PAGES?.split(',').map((n) => n.trim());
    const cases = pageCases(visit).filter((c) => !only || only.includes(c.name));
    browser = await chromium.launch({
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/lib/chromium/chromium',
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    });
    const cookies = { rider: visit.riderCookie, cart: visit.cartCookie };
    // A first, unmeasured pass of each so the servers' own first-request costs do not land on round 1.
    await measure(browser, floor.url, { ready: (p) => p.getByRole('heading', { level: 1 }).waitFor() }, null);
    for (const c of cases) await measure(browser, app.url, c, cookies);

    console.log(`\nfirst load, cold cache, CPU ${cpuSlowdown}× slower; JS = compressed script bodies (with response headers in brackets); ${rounds} rounds`);
    const floorRuns: Figures[] = [];
    const pageRuns = new Map<string, Figures[]>(cases.map((c) => [c.name, []]));
    const encodings = new Set<string>();
    for (let r = 0; r < rounds; r++) {
      const f = await measure(browser, floor.url, { ready: (p) => p.getByRole('heading', { level: 1 }).waitFor() }, null);
      floorRuns.push(f);
      f.encodings.forEach((e) => encodings.add(e));
      console.log(`\n  round ${r + 1}: floor (bare PrimeVue page) JS ${kB(f.jsBytes)} (${kB(f.wireBytes)} with headers) in ${f.scripts} scripts, LCP ${ms(f.lcpMs)}`);
      for (const c of cases) {
        const m = await measure(browser, app.url, c, cookies);
        pageRuns.get(c.name)!.push(m);
        m.encodings.forEach((e) => encodings.add(e));
        console.log(
          `    ${c.name.padEnd(16)} JS ${kB(m.jsBytes)} (${kB(m.wireBytes)} with headers) in ${String(m.scripts).padStart(2)} scripts (${(m.jsBytes / f.jsBytes).toFixed(2)}× floor), LCP ${ms(m.lcpMs)} (${(m.lcpMs / f.lcpMs).toFixed(2)}× floor)`,
        );
      }
    }
    const floorJs = median(floorRuns.map((f) => f.jsBytes));
    const floorLcp = median(floorRuns.map((f) => f.lcpMs));
    console.log(`\n  median: floor JS ${kB(floorJs)} (${kB(median(floorRuns.map((f) => f.wireBytes)))} with headers), LCP ${ms(floorLcp)}; target JS ≤ ${bytesTarget}× floor = ${kB(floorJs * bytesTarget)}, LCP < ${lcpTargetMs} ms on the landing page and the finder`);
    let missed = 0;
    for (const c of cases) {
      const runs = pageRuns.get(c.name)!;
      const js = median(runs.map((m) => m.jsBytes));
      const wire = median(runs.map((m) => m.wireBytes));
      const lcp = median(runs.map((m) => m.lcpMs));
      const lcpTargeted = c.name === 'landing' || c.name === 'finder';
      const ok = js <= floorJs * bytesTarget && (!lcpTargeted || lcp < lcpTargetMs);
      if (!ok) missed++;
      console.log(`    ${c.name.padEnd(16)} JS ${kB(js)} ${(js / floorJs).toFixed(2)}× floor (${kB(wire)} with headers), LCP ${ms(lcp)} ${(lcp / floorLcp).toFixed(2)}× floor  ${ok ? 'ok' : 'MISSED'}`);
    }
    console.log(`  script encodings sent: ${[...encodings].join(', ')}${encodings.has('identity') ? '  (some scripts went uncompressed)' : ''}`);
    console.log(`  ${missed ? `${missed} page(s) missed a target` : 'every page met its targets'}`);
  } finally {
    await browser?.close();
    await app?.close();
    await floor?.close();
    rmSync(floorDir, { recursive: true, force: true });
  }
}
