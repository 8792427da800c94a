import type { EntityManager } from 'typeorm';
import type { ExchangeDto } from '../../shared/commerce/exchange.dto';
import type { CurrencyCode } from '../../shared/money';
import { Exchange } from './Exchange.entity';

interface Joined {
  order_number: string;
  currency: CurrencyCode;
  name: string;
  sku: string;
  setup: { rateNPerMm?: number } | null;
}

/** The order number and the bought line each exchange shows, for many exchanges in one query. */
async function joinedOf(em: EntityManager, rows: Exchange[]): Promise<Map<string, Joined>> {
  if (!rows.length) return new Map();
  const found = (await em.query(
    `SELECT e.id, o.number AS order_number, o.currency, l.name, l.sku, l.setup
       FROM exchanges e JOIN orders o ON o.id = e.order_id JOIN order_lines l ON l.id = e.order_line_id
      WHERE e.id = ANY($1::uuid[])`,
    [rows.map((r) => r.id)],
  )) as (Joined & { id: string })[];
  return new Map(found.map((f) => [f.id, f]));
}

function toDto(e: Exchange, j: Joined): ExchangeDto {
  const iso = (d: Date | null) => (d ? d.toISOString() : null);
  return {
    id: e.id,
    number: e.number,
    kind: e.kind,
    state: e.state,
    settlement: e.settlement,
    orderId: e.orderId,
    orderNumber: j.order_number,
    orderLineId: e.orderLineId,
    email: e.email,
    bought: { productId: e.productId, name: j.name, sku: j.sku, rateNPerMm: j.setup?.rateNPerMm ?? null, quantity: e.quantity, unitPriceCents: e.paidUnitCents },
    replacement: e.replacement,
    currency: j.currency,
    differenceCents: e.differenceCents,
    reason: e.reason,
    reasonText: e.reasonText,
    sagCheck: e.sagCheck,
    staffMessage: e.staffMessage,
    // The payment page matters only while the difference is owed.
    paymentUrl: e.settlement === 'awaiting-payment' ? e.paymentUrl : null,
    carrier: e.carrier,
    trackingNumber: e.trackingNumber,
    createdAt: e.createdAt.toISOString(),
    decidedAt: iso(e.decidedAt),
    receivedAt: iso(e.receivedAt),
    settledAt: iso(e.settledAt),
    shippedAt: iso(e.shippedAt),
  };
}

export async function toExchangeDtos(em: EntityManager, rows: Exchange[]): Promise<ExchangeDto[]> {
  const joined = await joinedOf(em, rows);
  return rows.map((e) => toDto(e, joined.get(e.id)!));
}

export async function toExchangeDto(em: EntityManager, e: Exchange): Promise<ExchangeDto> {
  return (await toExchangeDtos(em, [e]))[0]!;
}
