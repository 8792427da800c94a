import type { EntityManager } from 'typeorm';
import type { Config } from '../config';
import { enqueueMail } from '../mail/outbox';
import { exchangeMail, type ExchangeMailStep } from '../mail/templates';
import { getShopSettings } from '../shop/shop-settings.service';
import { toExchangeDto } from './exchange-dto';
import type { Exchange } from './Exchange.entity';

/** The rider's page for their exchanges. */
export const exchangeUrl = (config: Pick<Config, 'publicOrigin'>, id: string) => `${config.publicOrigin}/exchanges?open=${id}`;

/**
 * Promises the mail for one step in the transaction of that step; the key is the exchange and the step, so a
 * repeated step (a retried request, a webhook delivered twice) never mails twice.
 */
export async function mailExchangeStep(em: EntityManager, config: Config, e: Exchange, step: ExchangeMailStep, extra: { refundedCents?: number } = {}): Promise<void> {
  const dto = await toExchangeDto(em, e);
  const shop = await getShopSettings(em);
  const [o] = (await em.query(`SELECT customer_name FROM orders WHERE id = $1`, [e.orderId])) as { customer_name: string }[];
  await enqueueMail(em, `exchange-${step}:${e.id}`, {
    to: e.email,
    ...exchangeMail({
      step,
      kind: e.kind,
      number: e.number,
      orderNumber: dto.orderNumber,
      customerName: o?.customer_name ?? '',
      shop: { name: shop.shopName, address: shop.shopAddress },
      currency: dto.currency,
      bought: dto.bought.name,
      replacement: dto.replacement?.name ?? null,
      quantity: e.quantity,
      differenceCents: e.differenceCents,
      staffMessage: e.staffMessage,
      paymentUrl: e.paymentUrl,
      refundedCents: extra.refundedCents ?? null,
      carrier: e.carrier,
      trackingNumber: e.trackingNumber,
      exchangeUrl: exchangeUrl(config, e.id),
    }),
  });
}
