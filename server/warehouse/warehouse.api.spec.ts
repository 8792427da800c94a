import request from 'supertest';
import { describe, expect, it } from 'vitest';
import type { OrderDto } from '../../shared/commerce/order.dto';
import type { PickListDto, WarehouseQueueDto } from '../../shared/warehouse/fulfilment.dto';
import { AppDataSource } from '../db/data-source';
import { address, ledgerSumOf, plainProduct, stockOf } from '../test/commerce-factories';
import { createUser, testPassword, userWithToken } from '../test/factories';
import { eventually, paymentsApp, payOnPage, type PaymentsApp } from '../test/payments-standin';

/** A rider's paid order of 2 preload collars and 1 seal kit, through the cart, checkout and the stand-in's payment page. */
async function paidOrder(a?: PaymentsApp) {
  if (!a) {
    a = await paymentsApp();
  }
  const rider = await createUser();
  const agent = request.agent(a.app);
  await agent.post('/api/auth/login').send({ email: rider.email, password: testPassword }).expect(200);
  const p = await plainProduct(5, 3_000, 'Preload collar');
  const q = await plainProduct(5, 1_200, 'Seal kit');
  await agent.post('/api/cart/lines').send({ productId: p.id, quantity: 2 }).expect(201);
  await agent.post('/api/cart/lines').send({ productId: q.id, quantity: 1 }).expect(201);
  const { orderId, paymentUrl } = (await agent.post('/api/checkout').send({ email: rider.email, shippingAddress: address }).expect(201)).body;
  await payOnPage(paymentUrl, '4242424242424242');
  await eventually(async () => (await agent.get(`/api/orders/${orderId}`)).body.paymentStatus === 'paid', 'the payment');
  const warehouse = await userWithToken(a.config, 'warehouse');
  return { a, rider, agent, p, q, orderId: orderId as string, warehouse };
}

const skuOf = async (productId: string) => ((await AppDataSource.query(`SELECT sku FROM products WHERE id = $1`, [productId])) as { sku: string }[])[0]!.sku;
const shippedMails = async (orderId: string) =>
  (await AppDataSource.query(
    `SELECT m.subject, m.text_body FROM mail_outbox m JOIN orders o ON o.email = m.recipient WHERE o.id = $1 AND m.dedupe_key LIKE 'shipped:%' ORDER BY m.created_at`,
    [orderId],
  )) as { subject: string; text_body: string }[];

describe('warehouse', () => {
  it('only the warehouse and admins use the warehouse routes: a guest is asked to sign in, riders and staff are refused', async () => {
    const { a, orderId, warehouse } = await paidOrder();
    const rider = await userWithToken(a.config, 'rider');
    const staff = await userWithToken(a.config, 'staff');
    const admin = await userWithToken(a.config, 'admin');
    const routes = [
      ['get', '/api/warehouse/orders'],
      ['get', `/api/warehouse/orders/${orderId}`],
      ['post', `/api/warehouse/orders/${orderId}/scan`],
      ['post', `/api/warehouse/orders/${orderId}/pack`],
      ['post', `/api/warehouse/orders/${orderId}/ship`],
      ['post', `/api/warehouse/orders/${orderId}/deliver`],
    ] as const;
    for (const [method, path] of routes) {
      expect((await a.http[method](path).send({})).status, `${method} ${path} as a guest`).toBe(401);
      expect((await a.http[method](path).set(rider.auth).send({})).status, `${method} ${path} as a rider`).toBe(403);
      expect((await a.http[method](path).set(staff.auth).send({})).status, `${method} ${path} as staff`).toBe(403);
    }
    expect((await a.http.get('/api/warehouse/orders').set(warehouse.auth)).status).toBe(200);
    expect((await a.http.get(`/api/warehouse/orders/${orderId}`).set(admin.auth)).status).toBe(200);
  });

  it('pick by scan and by tick, pack, ship with a tracking number, deliver: each step guarded, the shipped mail queued, the rider sees the parcel', async () => {
    const { a, agent, p, q, orderId, warehouse } = await paidOrder();
    const w = (req: request.Test) => req.set(warehouse.auth);
    const queue = (await w(a.http.get('/api/warehouse/orders')).expect(200)).body as WarehouseQueueDto;
    expect(queue.items.map((i) => [i.id, i.fulfilmentStatus, i.units, i.unitsPicked])).toEqual([[orderId, 'unfulfilled', 3, 0]]);
    expect(queue.counts).toEqual({ unfulfilled: 1, packed: 0, 'partially-shipped': 0, shipped: 0, delivered: 0 });

    const list = (await w(a.http.get(`/api/warehouse/orders/${orderId}`)).expect(200)).body as PickListDto;
    expect(list.lines.map((l) => [l.productId, l.binLocation, l.quantity, l.due])).toEqual(expect.arrayContaining([[p.id, 'T-01', 2, 2], [q.id, 'T-01', 1, 1]]));
    for (const l of list.lines) {
      expect(l.barcode).toMatch(/^data:image\/svg\+xml;base64,/);
      expect(Buffer.from(l.barcode.split(',')[1]!, 'base64').toString()).toMatch(/^<svg[\s\S]*<\/svg>\s*$/);
    }
    expect(list).toMatchObject({ mayPick: true, mayPack: false, shipWouldLeave: null, mayDeliver: false });

    // Nothing may skip a step.
    expect((await w(a.http.post(`/api/warehouse/orders/${orderId}/pack`))).status).toBe(409);
    expect((await w(a.http.post(`/api/warehouse/orders/${orderId}/ship`)).send({ carrier: 'Parcel Co', trackingNumber: 'PC123456' })).status).toBe(409);
    expect((await w(a.http.post(`/api/warehouse/orders/${orderId}/deliver`))).status).toBe(409);

    const unknown = await w(a.http.post(`/api/warehouse/orders/${orderId}/scan`)).send({ code: 'LL-NOT-HERE' });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields).toEqual({ code: 'LL-NOT-HERE is not on this order.' });
    const pSku = await skuOf(p.id);
    await w(a.http.post(`/api/warehouse/orders/${orderId}/scan`)).send({ code: pSku.toLowerCase() }).expect(200);
    await w(a.http.post(`/api/warehouse/orders/${orderId}/scan`)).send({ code: pSku }).expect(200);
    const third = await w(a.http.post(`/api/warehouse/orders/${orderId}/scan`)).send({ code: pSku });
    expect(third.status).toBe(409);
    expect(third.body.message).toContain('already picked');
    const qLine = list.lines.find((l) => l.productId === q.id)!;
    expect((await w(a.http.put(`/api/warehouse/orders/${orderId}/lines/${qLine.id}/picked`)).send({ pickedQuantity: 2 })).body.fields).toHaveProperty('pickedQuantity');
    const ticked = (await w(a.http.put(`/api/warehouse/orders/${orderId}/lines/${qLine.id}/picked`)).send({ pickedQuantity: 1 }).expect(200)).body as PickListDto;
    expect(ticked).toMatchObject({ mayPack: true });

    const packed = (await w(a.http.post(`/api/warehouse/orders/${orderId}/pack`)).expect(200)).body as PickListDto;
    expect(packed).toMatchObject({ fulfilmentStatus: 'packed', mayPick: false, shipWouldLeave: 'shipped' });
    expect((await w(a.http.post(`/api/warehouse/orders/${orderId}/pack`))).status).toBe(409);
    expect((await w(a.http.put(`/api/warehouse/orders/${orderId}/lines/${qLine.id}/picked`)).send({ pickedQuantity: 0 })).status).toBe(409);
    // Packed orders can no longer be cancelled by the rider.
    expect((await agent.post(`/api/orders/${orderId}/cancel`).send({})).status).toBe(409);

    const bad = await w(a.http.post(`/api/warehouse/orders/${orderId}/ship`)).send({ carrier: '', trackingNumber: '<x>' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields).sort()).toEqual(['carrier', 'trackingNumber']);
    const shipped = (await w(a.http.post(`/api/warehouse/orders/${orderId}/ship`)).send({ carrier: 'Parcel Co', trackingNumber: 'pc 1234-5678' }).expect(200)).body as PickListDto;
    expect(shipped).toMatchObject({ fulfilmentStatus: 'shipped', mayDeliver: true, shipWouldLeave: null });
    expect(shipped.shipments).toEqual([expect.objectContaining({ carrier: 'Parcel Co', trackingNumber: 'PC 1234-5678', backOrdered: false })]);
    const mails = await shippedMails(orderId);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toMatch(/is on its way/);
    expect(mails[0]!.text_body).toContain('PC 1234-5678');

    const seen = (await agent.get(`/api/orders/${orderId}`).expect(200)).body as OrderDto;
    expect(seen).toMatchObject({ fulfilmentStatus: 'shipped', shipments: [expect.objectContaining({ carrier: 'Parcel Co', trackingNumber: 'PC 1234-5678' })] });
    expect(seen.lines.map((l) => l.shippedQuantity).sort()).toEqual([1, 2]);

    await w(a.http.post(`/api/warehouse/orders/${orderId}/deliver`)).expect(200);
    expect((await w(a.http.post(`/api/warehouse/orders/${orderId}/deliver`))).status).toBe(409);
    expect((await agent.get(`/api/orders/${orderId}`)).body.fulfilmentStatus).toBe('delivered');
    const after = (await w(a.http.get('/api/warehouse/orders')).expect(200)).body as WarehouseQueueDto;
    expect(after.items).toEqual([]);
    expect(after.counts.delivered).toBe(1);
    // Shipping takes nothing more off the shelf: the units left it at checkout, and the ledger says so.
    expect(await stockOf(p.id)).toBe(3);
    expect(await ledgerSumOf(p.id)).toBe(3);
  }, 60_000);

  it('a short line ships later: the first parcel leaves the order partially shipped, the back-order ships on its own, two mails', async () => {
    const { a, q, orderId, warehouse } = await paidOrder();
    const w = (req: request.Test) => req.set(warehouse.auth);
    const list = (await w(a.http.get(`/api/warehouse/orders/${orderId}`))).body as PickListDto;
    const qLine = list.lines.find((l) => l.productId === q.id)!;
    const other = list.lines.find((l) => l.productId !== q.id)!;
    await w(a.http.put(`/api/warehouse/orders/${orderId}/lines/${other.id}/picked`)).send({ pickedQuantity: 1 }).expect(200);
    await w(a.http.post(`/api/warehouse/orders/${orderId}/pack`)).expect(200);
    const first = (await w(a.http.post(`/api/warehouse/orders/${orderId}/ship`)).send({ carrier: 'Parcel Co', trackingNumber: 'PC-0001' }).expect(200)).body as PickListDto;
    expect(first.fulfilmentStatus).toBe('partially-shipped');
    expect(first.shipments[0]).toMatchObject({ backOrdered: true, lines: [{ orderLineId: other.id, quantity: 1 }] });
    expect(first).toMatchObject({ mayPick: true, shipWouldLeave: null, mayDeliver: false });
    expect((await w(a.http.post(`/api/warehouse/orders/${orderId}/ship`)).send({ carrier: 'Parcel Co', trackingNumber: 'PC-0002' })).status).toBe(409);
    expect((await w(a.http.post(`/api/warehouse/orders/${orderId}/deliver`))).status).toBe(409);
    // Already shipped units cannot be un-picked.
    expect((await w(a.http.put(`/api/warehouse/orders/${orderId}/lines/${other.id}/picked`)).send({ pickedQuantity: 0 })).status).toBe(400);

    const queue = (await w(a.http.get('/api/warehouse/orders'))).body as WarehouseQueueDto;
    expect(queue.counts['partially-shipped']).toBe(1);
    await w(a.http.put(`/api/warehouse/orders/${orderId}/lines/${other.id}/picked`)).send({ pickedQuantity: 2 }).expect(200);
    const still = (await w(a.http.get(`/api/warehouse/orders/${orderId}`))).body as PickListDto;
    expect(still.shipWouldLeave).toBe('partially-shipped');
    await w(a.http.put(`/api/warehouse/orders/${orderId}/lines/${qLine.id}/picked`)).send({ pickedQuantity: 1 }).expect(200);
    const second = (await w(a.http.post(`/api/warehouse/orders/${orderId}/ship`)).send({ carrier: 'Parcel Co', trackingNumber: 'PC-0002' }).expect(200)).body as PickListDto;
    expect(second.fulfilmentStatus).toBe('shipped');
    expect(second.shipments.map((s) => [s.trackingNumber, s.backOrdered, s.lines.reduce((n, l) => n + l.quantity, 0)])).toEqual([['PC-0001', true, 1], ['PC-0002', false, 2]]);
    expect((await shippedMails(orderId)).map((m) => m.text_body.includes('PC-0002'))).toEqual([false, true]);
  }, 60_000);

  it('two warehouse users packing the same order at once: exactly one succeeds, the other hears it is already packed', async () => {
    const a = await paymentsApp();
    const b = await paymentsApp();
    const { orderId, warehouse } = await paidOrder(a);
    const second = await userWithToken(a.config, 'warehouse');
    const list = (await a.http.get(`/api/warehouse/orders/${orderId}`).set(warehouse.auth)).body as PickListDto;
    await a.http.put(`/api/warehouse/orders/${orderId}/lines/${list.lines[0]!.id}/picked`).set(warehouse.auth).send({ pickedQuantity: list.lines[0]!.quantity }).expect(200);
    const packers = [warehouse, second, warehouse, second, warehouse, second];
    const answers = await Promise.all(packers.map((u, i) => request([a, b][i % 2]!.app).post(`/api/warehouse/orders/${orderId}/pack`).set(u.auth)));
    expect(answers.map((r) => r.status).sort()).toEqual([200, 409, 409, 409, 409, 409]);
    const refusal = answers.find((r) => r.status === 409)!;
    expect(refusal.body.message).toContain('cannot go from packed to packed');
    const winner = packers[answers.findIndex((r) => r.status === 200)]!;
    expect(await AppDataSource.query(`SELECT fulfilment_status, packed_by FROM orders WHERE id = $1`, [orderId])).toEqual([{ fulfilment_status: 'packed', packed_by: winner.user.id }]);
  }, 60_000);

  it('an unpaid order is not the warehouse’s: 404', async () => {
    const a = await paymentsApp();
    const rider = await createUser();
    const agent = request.agent(a.app);
    await agent.post('/api/auth/login').send({ email: rider.email, password: testPassword }).expect(200);
    const p = await plainProduct(3);
    await agent.post('/api/cart/lines').send({ productId: p.id, quantity: 1 }).expect(201);
    const { orderId } = (await agent.post('/api/checkout').send({ email: rider.email, shippingAddress: address }).expect(201)).body;
    const warehouse = await userWithToken(a.config, 'warehouse');
    expect((await a.http.get(`/api/warehouse/orders/${orderId}`).set(warehouse.auth)).status).toBe(404);
    expect((await a.http.post(`/api/warehouse/orders/${orderId}/pack`).set(warehouse.auth)).status).toBe(404);
    expect(((await a.http.get('/api/warehouse/orders').set(warehouse.auth)).body as WarehouseQueueDto).items).toEqual([]);
    // Its reservation is in the ledger already, and the sum still matches the shelf.
    expect(await AppDataSource.query(`SELECT reason, quantity, order_id FROM stock_movements WHERE product_id = $1 ORDER BY created_at`, [p.id])).toEqual([
      { reason: 'receipt', quantity: 3, order_id: null },
      { reason: 'sale', quantity: -1, order_id: orderId },
    ]);
    expect(await ledgerSumOf(p.id)).toBe(await stockOf(p.id));
  }, 60_000);
});
