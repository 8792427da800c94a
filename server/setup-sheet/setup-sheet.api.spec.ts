import { PDFParse } from 'pdf-parse';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { RecommendationDto, ShockRecommendationDto, ForkRecommendationDto } from '../../shared/catalogue';
import type { SetupSheetDto } from '../../shared/setup-sheet/setup-sheet.dto';
import { torqueText } from '../../shared/setup-sheet/build';
import { nmToFtLbf } from '../../shared/units';
import { address, load, shopWithSprings } from '../test/commerce-factories';
import { testApp } from '../test/factories';
import { paymentsApp } from '../test/payments-standin';

/** The test bike's ladders, the recommendation for the shared test load, and the first ok spring at each end. */
async function plan(t: ReturnType<typeof testApp>) {
  const shop = await shopWithSprings(t);
  const rec = (await t.http.post('/api/recommendations').send({ fitmentId: shop.fitment.id, ...load }).expect(200)).body as RecommendationDto;
  const fork = (rec.fork as ForkRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
  const shock = (rec.shock as ShockRecommendationDto).candidates.find((c) => c.verdict === 'ok')!;
  const query = new URLSearchParams({ fitmentId: shop.fitment.id, ridingStyle: 'road', riderKg: '95', gearKg: '8', forkId: fork.id, shockId: shock.id });
  return { ...shop, rec, fork, shock, query };
}

/** The PDF's text, one run of spaces per gap, so a figure reads the same as on the page. */
async function pdfText(bytes: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return (await parser.getText()).text.replace(/\s+/g, ' ');
  } finally {
    await parser.destroy();
  }
}

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('setup sheet', () => {
  it('gives the finder\'s figures for the chosen springs, with torques in N·m and ft·lbf and a fork sold as one pair', async () => {
    const t = testApp();
    const { fork, shock, query, fitment } = await plan(t);
    const res = await t.http.get(`/api/setup-sheet?${query}`);
    expect(res.status).toBe(200);
    const sheet = res.body as SetupSheetDto;
    const f = sheet.ends.find((e) => e.end === 'fork')!;
    const s = sheet.ends.find((e) => e.end === 'shock')!;
    // The same engine run as the finder's: every figure equals the recommendation's for this load.
    expect(f).toMatchObject({ productId: fork.id, preloadMm: fork.preloadMm, staticSagMm: fork.staticSagMm, riderSagMm: fork.riderSagMm, installedLengthMm: fork.installedLengthMm });
    expect(f.adjusterTurns).toBe(fork.adjusterTurns);
    expect(s).toMatchObject({ productId: shock.id, preloadMm: shock.preloadMm, staticSagMm: shock.staticSagMm, riderSagMm: shock.riderSagMm, toleranceMm: 3 });
    expect(s.adjusterTurns).toBe(shock.adjusterTurns);
    // Two fork legs, one pair bought at the pair's price; one shock spring.
    expect([f.springCount, f.units, f.unitWords]).toEqual([2, 1, '1 pair (2 springs)']);
    expect(f.rows.find((r) => r.key === 'price')!.value).toBe('€64.50 per pair');
    expect(f.rows.find((r) => r.key === 'rate')!.label).toBe('Rate, per spring');
    expect([s.units, s.rows.find((r) => r.key === 'price')!.value]).toEqual([1, '€159.00 per spring']);
    // 1 ft·lbf = 1.3558179483 N·m (NIST SP 811, 2008, appendix B.8): 45 N·m is 33.19 ft·lbf.
    const lower = sheet.torques.find((x) => x.fastener === 'Shock lower bolt')!;
    expect(lower.torqueNm).toBe(45);
    expect(lower.torqueFtLbf).toBeCloseTo(45 / 1.3558179483, 6);
    expect(lower.text).toBe('45 N·m (33.2 ft·lbf)');
    expect(sheet.tools).toEqual(['Spring compressor', 'Sag tool']);
    expect(sheet.bikeLabel).toContain(fitment.model);
    expect(sheet.cautions.join(' ')).toMatch(/Secure the bike/);
    expect(sheet.cautions.join(' ')).toMatch(/compressors .* store energy/);
    expect(sheet.cautions.join(' ')).toMatch(/qualified technician/);
    expect(sheet.disturbedSteps.join(' ')).toMatch(/oil level \(or air gap\)/);
    expect(sheet.disturbedSteps.join(' ')).toMatch(/Both legs the same/);
  });

  it('the PDF is made on the server with Inter embedded and carries the same preload, turns and torque figures as the JSON', async () => {
    const t = testApp();
    const { query } = await plan(t);
    const sheet = (await t.http.get(`/api/setup-sheet?${query}`).expect(200)).body as SetupSheetDto;
    const res = await t.http.get(`/api/setup-sheet/pdf?${query}`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="setup-sheet-[a-z0-9-]+\.pdf"$/);
    const bytes = res.body as Buffer;
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    // Embedded subsets are named "ABCDEF+Inter…"; a standard font would be named Helvetica and not embedded.
    expect(bytes.toString('latin1')).toMatch(/\/BaseFont \/[A-Z]{6}\+Inter/);
    expect(bytes.toString('latin1')).not.toMatch(/Helvetica/);
    const text = await pdfText(bytes);
    for (const end of sheet.ends) {
      for (const key of ['preload', 'adjuster', 'static-sag', 'rider-sag', 'price']) {
        const row = end.rows.find((r) => r.key === key);
        if (row) expect(text).toContain(row.value);
      }
    }
    expect(sheet.ends.every((e) => e.rows.some((r) => r.key === 'adjuster'))).toBe(true);
    for (const tq of sheet.torques) expect(text).toContain(tq.text);
    expect(text).toContain(torqueText(23));
    // 23 N·m ÷ 1.3558179483 N·m per ft·lbf (NIST SP 811, 2008, B.8) = 16.96 ft·lbf, shown to 0.1 as 17.
    expect(nmToFtLbf(23)).toBeCloseTo(16.964, 3);
    expect(text).toContain('23 N·m (17 ft·lbf)');
    expect(text).toMatch(/Secure the bike upright/);
    expect(text).toMatch(/both legs|Both legs the same/);
  });

  it('names each query field that needs attention, and a spring the bike does not take', async () => {
    const t = testApp();
    const { query, fitment, shocks } = await plan(t);
    const bad = await t.http.get(`/api/setup-sheet?fitmentId=${fitment.id}&ridingStyle=road&riderKg=heavy&forkId=nope`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields).sort()).toEqual(['forkId', 'riderKg']);
    const none = await t.http.get(`/api/setup-sheet?fitmentId=${fitment.id}&ridingStyle=road&riderKg=95`);
    expect(none.status).toBe(400);
    expect(none.body.fields.forkId).toMatch(/Choose/);
    const wrongEnd = new URLSearchParams(query);
    wrongEnd.set('forkId', shocks[0]!.id);
    const refused = await t.http.get(`/api/setup-sheet/pdf?${wrongEnd}`);
    expect(refused.status).toBe(400);
    expect(refused.body.fields.forkId).toMatch(/not one the shop offers/);
    const missing = new URLSearchParams(query);
    missing.set('fitmentId', '00000000-0000-4000-8000-000000000000');
    expect((await t.http.get(`/api/setup-sheet?${missing}`)).status).toBe(404);
  });

  it('an order\'s sheet shows the figures kept with its spring set, for its buyer\'s link only', async () => {
    const a = await paymentsApp();
    const { fork, shock, fitment } = await plan(a);
    const agent = request.agent(a.app);
    await agent.post('/api/cart/spring-set').send({ fitmentId: fitment.id, ...load, forkProductId: fork.id, shockProductId: shock.id }).expect(201);
    const { orderId, accessToken } = (await agent.post('/api/checkout').send({ email: 'buyer@example.test', shippingAddress: address }).expect(201)).body;
    const sheet = (await a.http.get(`/api/setup-sheet/orders/${orderId}?token=${accessToken}`).expect(200)).body as SetupSheetDto;
    expect(sheet.source).toBe('order');
    expect(sheet.orderNumber).toMatch(/\w/);
    const f = sheet.ends.find((e) => e.end === 'fork')!;
    expect([f.preloadMm, f.adjusterTurns, f.units, f.rows.find((r) => r.key === 'price')!.value]).toEqual([fork.preloadMm, fork.adjusterTurns, 1, '€64.50 per pair']);
    expect(sheet.torques.map((x) => x.text)).toContain('45 N·m (33.2 ft·lbf)');
    const pdf = await a.http.get(`/api/setup-sheet/orders/${orderId}/pdf?token=${accessToken}`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    expect(await pdfText(pdf.body as Buffer)).toContain(f.rows.find((r) => r.key === 'preload')!.value);
    expect((await a.http.get(`/api/setup-sheet/orders/${orderId}`)).status).toBe(404);
    expect((await a.http.get(`/api/setup-sheet/orders/${orderId}/pdf?token=${accessToken.startsWith('x') ? 'y' : 'x'}${accessToken.slice(1)}`)).status).toBe(404);
  });
});
