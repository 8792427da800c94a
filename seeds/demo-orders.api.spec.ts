import { describe, expect, it } from 'vitest';
import type { OrderDto } from '../shared/commerce/order.dto';
import { AppDataSource } from '../server/db/data-source';
import { shopSettingsChanged } from '../server/shop/shop-settings.service';
import { userWithToken } from '../server/test/factories';
import { paymentsApp } from '../server/test/payments-standin';
import { seedDemo } from './demo';
import { seedDemoOrders } from './demo-orders';

describe('the paid demo orders', () => {
  it('are paid on the local payment stand-in, so staff refund one there like any order', async () => {
    const a = await paymentsApp();
    await AppDataSource.transaction((em) => seedDemo(em));
    shopSettingsChanged();
    expect(await seedDemoOrders(a.config)).toBe(2);
    const orders = (await AppDataSource.query(`SELECT id, number, payment_status, payment_intent_id, total_cents FROM orders ORDER BY number`)) as { id: string; number: string; payment_status: string; payment_intent_id: string; total_cents: number }[];
    expect(orders.map((o) => o.payment_status)).toEqual(['paid', 'paid']);
    for (const o of orders) expect(o.payment_intent_id).toMatch(/^pi_/);
    const staff = await userWithToken(a.config, 'staff');
    const refunded = (await a.http.post(`/api/staff/orders/${orders[0]!.id}/refunds`).set(staff.auth).send({ restock: false, reason: 'Demo refund' }).expect(201)).body as OrderDto;
    expect(refunded).toMatchObject({ paymentStatus: 'refunded', refundedCents: orders[0]!.total_cents });
    expect(refunded.refunds).toEqual([expect.objectContaining({ amountCents: orders[0]!.total_cents })]);
    const [row] = (await AppDataSource.query(`SELECT provider_refund_id FROM refunds WHERE order_id = $1`, [orders[0]!.id])) as { provider_refund_id: string }[];
    expect(row!.provider_refund_id).toMatch(/^re_/);
  });
});
