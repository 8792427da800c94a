import { describe, expect, it } from 'vitest';
import type { StaffProductDto } from '../../shared/catalogue';
import type { DeliveryReceivedDto, LowStockListDto, StockMovementPageDto } from '../../shared/warehouse/stock.dto';
import { defaultLowStockThreshold } from '../../shared/warehouse/stock';
import { ledgerSumOf, plainProduct, stockOf } from '../test/commerce-factories';
import { productInput } from '../test/catalogue-factories';
import { testApp, userWithToken } from '../test/factories';

describe('stock', () => {
  it('a delivery is received by staff or the warehouse against its reference: one receipt per line, who and when in the ledger', async () => {
    const t = testApp();
    const warehouse = await userWithToken(t.config, 'warehouse', { displayName: 'Dock Hand' });
    const p = await plainProduct(1);
    const q = await plainProduct(0);
    const res = await t.http.post('/api/staff/stock/deliveries').set(warehouse.auth).send({ deliveryRef: ' DN-2041 ', lines: [{ productId: q.id, quantity: 4 }, { productId: p.id, quantity: 6 }] });
    expect(res.status).toBe(201);
    const body = res.body as DeliveryReceivedDto;
    expect(body.deliveryRef).toBe('DN-2041');
    expect(body.lines.map((l) => [l.productId, l.quantity, l.stockAfter]).sort()).toEqual([[p.id, 6, 7], [q.id, 4, 4]].sort());
    expect(await stockOf(p.id)).toBe(7);
    expect(await ledgerSumOf(p.id)).toBe(7);
    const ledger = (await t.http.get('/api/staff/stock/movements').set(warehouse.auth).query({ productId: p.id }).expect(200)).body as StockMovementPageDto;
    expect(ledger.items.map((m) => [m.reason, m.quantity, m.stockAfter, m.deliveryRef, m.actorName])).toEqual([
      ['receipt', 6, 7, 'DN-2041', 'Dock Hand'],
      ['receipt', 1, 1, 'TEST-OPENING', null],
    ]);
    expect(Date.parse(ledger.items[0]!.createdAt)).toBeGreaterThan(Date.now() - 60_000);
    const staff = await userWithToken(t.config, 'staff');
    expect((await t.http.post('/api/staff/stock/deliveries').set(staff.auth).send({ deliveryRef: 'DN-2042', lines: [{ productId: p.id, quantity: 1 }] })).status).toBe(201);
    const shelf = (await t.http.get('/api/staff/stock/products').set(warehouse.auth).expect(200)).body.items as { id: string; stockOnHand: number; binLocation: string }[];
    expect(shelf.find((x) => x.id === p.id)).toMatchObject({ stockOnHand: 8, binLocation: 'T-01' });
  });

  it('a delivery with bad lines is a 400 naming each field, and receives nothing', async () => {
    const t = testApp();
    const staff = await userWithToken(t.config, 'staff');
    const p = await plainProduct(2);
    const bad = await t.http.post('/api/staff/stock/deliveries').set(staff.auth).send({ deliveryRef: '  ', lines: [{ productId: p.id, quantity: 0 }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields).sort()).toEqual(['deliveryRef', 'lines.0.quantity']);
    const missing = await t.http.post('/api/staff/stock/deliveries').set(staff.auth).send({ deliveryRef: 'DN-1', lines: [{ productId: p.id, quantity: 1 }, { productId: '00000000-0000-4000-8000-000000000000', quantity: 1 }] });
    expect(missing.status).toBe(400);
    expect(missing.body.fields).toEqual({ 'lines.1.productId': 'No such product.' });
    const twice = await t.http.post('/api/staff/stock/deliveries').set(staff.auth).send({ deliveryRef: 'DN-1', lines: [{ productId: p.id, quantity: 1 }, { productId: p.id, quantity: 2 }] });
    expect(twice.status).toBe(400);
    expect(await stockOf(p.id)).toBe(2);
    expect((await t.http.get('/api/staff/stock/movements').set(staff.auth).query({ reason: 'lost' })).body.fields).toHaveProperty('reason');
  });

  it('riders and guests cannot see or change stock', async () => {
    const t = testApp();
    const rider = await userWithToken(t.config, 'rider');
    for (const [method, path] of [['get', '/api/staff/stock/movements'], ['get', '/api/staff/stock/low'], ['get', '/api/staff/stock/products'], ['post', '/api/staff/stock/deliveries']] as const) {
      expect((await t.http[method](path).send({})).status).toBe(401);
      expect((await t.http[method](path).set(rider.auth).send({})).status).toBe(403);
    }
    const warehouse = await userWithToken(t.config, 'warehouse');
    const p = await plainProduct(1);
    // Thresholds are the staff's call; the warehouse reads them.
    expect((await t.http.put(`/api/staff/stock/products/${p.id}/threshold`).set(warehouse.auth).send({ threshold: 2 })).status).toBe(403);
  });

  it('the low-stock list holds products at or under their own threshold, else the default, emptiest first', async () => {
    const t = testApp();
    const staff = await userWithToken(t.config, 'staff');
    const empty = (await t.http.post('/api/staff/products').set(staff.auth).send(productInput({ sku: 'LL-LOW-0', stockOnHand: 0 })).expect(201)).body as StaffProductDto;
    const atDefault = (await t.http.post('/api/staff/products').set(staff.auth).send(productInput({ sku: 'LL-LOW-D', stockOnHand: defaultLowStockThreshold })).expect(201)).body as StaffProductDto;
    const plenty = (await t.http.post('/api/staff/products').set(staff.auth).send(productInput({ sku: 'LL-LOW-P', stockOnHand: 20 })).expect(201)).body as StaffProductDto;
    let low = (await t.http.get('/api/staff/stock/low').set(staff.auth).expect(200)).body as LowStockListDto;
    expect(low.items.map((i) => [i.sku, i.stockOnHand, i.threshold, i.thresholdIsDefault])).toEqual([
      ['LL-LOW-0', 0, defaultLowStockThreshold, true],
      ['LL-LOW-D', defaultLowStockThreshold, defaultLowStockThreshold, true],
    ]);
    await t.http.put(`/api/staff/stock/products/${plenty.id}/threshold`).set(staff.auth).send({ threshold: 25 }).expect(200);
    await t.http.put(`/api/staff/stock/products/${atDefault.id}/threshold`).set(staff.auth).send({ threshold: 0 }).expect(200);
    low = (await t.http.get('/api/staff/stock/low').set(staff.auth).expect(200)).body as LowStockListDto;
    expect(low.items.map((i) => [i.sku, i.threshold, i.thresholdIsDefault])).toEqual([
      ['LL-LOW-0', defaultLowStockThreshold, true],
      ['LL-LOW-P', 25, false],
    ]);
    // A product without its own threshold follows the shop settings' threshold as the admin changes it.
    const admin = await userWithToken(t.config, 'admin');
    const { updatedAt: _at, ...settings } = (await t.http.get('/api/admin/shop-settings').set(admin.auth).expect(200)).body as Record<string, unknown>;
    await t.http.put('/api/admin/shop-settings').set(admin.auth).send({ ...settings, lowStockThreshold: defaultLowStockThreshold + 20 }).expect(200);
    low = (await t.http.get('/api/staff/stock/low').set(staff.auth).expect(200)).body as LowStockListDto;
    expect(low.items.map((i) => [i.sku, i.threshold, i.thresholdIsDefault])).toEqual([
      ['LL-LOW-0', defaultLowStockThreshold + 20, true],
      ['LL-LOW-P', 25, false],
    ]);
    await t.http.put('/api/admin/shop-settings').set(admin.auth).send(settings).expect(200);
    // Opening counts of products added by staff are ledger rows too.
    for (const p of [empty, atDefault, plenty]) expect(await ledgerSumOf(p.id)).toBe(await stockOf(p.id));
    expect((await t.http.put(`/api/staff/stock/products/${plenty.id}/threshold`).set(staff.auth).send({ threshold: -1 })).status).toBe(400);
  });
});
