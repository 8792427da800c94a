import type { ExchangeCountDto, ExchangeDecisionDto, ExchangeDto, ExchangeQueryDto, ExchangeShipDto } from '../../shared/commerce/exchange.dto';
import { settlementFor, type ExchangeState } from '../../shared/exchange-status';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { lockOrder } from '../orders/order-moves';
import { recordRefund, refundThroughProvider } from '../orders/refunds.service';
import { Refund } from '../orders/Refund.entity';
import type { PaymentProvider } from '../payments/payment-provider';
import { toExchangeDto, toExchangeDtos } from './exchange-dto';
import { mailExchangeStep } from './exchange-mail';
import { lockExchange, moveExchange } from './exchange-moves';
import { openDifferencePayment } from './exchange-payments';
import { moveExchangeStock } from './exchange-stock';
import { Exchange } from './Exchange.entity';

/** Exchanges and returns for the back office and the warehouse, filtered by state and reason, oldest first. */
export async function listExchanges(q: ExchangeQueryDto): Promise<ExchangeDto[]> {
  const where: { state?: ExchangeState; reason?: ExchangeDto['reason'] } = {};
  if (q.state) where.state = q.state;
  if (q.reason) where.reason = q.reason;
  const rows = await AppDataSource.getRepository(Exchange).find({ where, order: { createdAt: 'ASC' }, take: q.limit ?? 100 });
  return toExchangeDtos(AppDataSource.manager, rows);
}

export async function viewExchange(id: string): Promise<ExchangeDto> {
  const e = await AppDataSource.getRepository(Exchange).findOneBy({ id });
  if (!e) throw AppError.notFound('The exchange');
  return toExchangeDto(AppDataSource.manager, e);
}

/** Exchanges and returns counted by state and reason, optionally only some states (the dashboard's open ones). */
export async function countExchangesByStateAndReason(states?: ExchangeState[]): Promise<ExchangeCountDto[]> {
  const rows = (await AppDataSource.query(
    `SELECT state, reason, kind, count(*)::int AS count FROM exchanges WHERE ($1::text[] IS NULL OR state = ANY($1::text[]))
      GROUP BY state, reason, kind ORDER BY state, reason, kind`,
    [states ?? null],
  )) as ExchangeCountDto[];
  return rows;
}

/**
 * Staff approve or refuse with a message. Approving fixes the difference: a dearer rate opens a payment page for it,
 * a cheaper one or a return is refunded when the spring comes back. State, payment page and mail commit together.
 */
export async function decideExchange(config: Config, provider: PaymentProvider, actorId: string, id: string, dto: ExchangeDecisionDto): Promise<ExchangeDto> {
  return AppDataSource.transaction(async (em) => {
    const e = await lockExchange(em, id);
    const to = dto.approve ? 'approved' : 'refused';
    e.staffMessage = dto.message.trim();
    e.decidedBy = actorId;
    if (dto.approve) {
      e.settlement = settlementFor(e.differenceCents);
      if (e.settlement === 'awaiting-payment' && e.state === 'requested') {
        const [o] = (await em.query(`SELECT currency FROM orders WHERE id = $1`, [e.orderId])) as { currency: string }[];
        await openDifferencePayment(config, provider, e, o!.currency, `${e.number}: ${e.replacement?.name ?? ''}`);
      }
    }
    await moveExchange(em, e, to);
    await mailExchangeStep(em, config, e, to);
    return toExchangeDto(em, e);
  });
}

/**
 * The warehouse receives the returned spring: back on the shelf through the stock ledger, and any refund due goes
 * through the provider on the order it was paid with; a return ends here. One transaction with the mails.
 */
export async function receiveReturn(config: Config, provider: PaymentProvider, actorId: string, id: string): Promise<ExchangeDto> {
  return AppDataSource.transaction(async (em) => {
    const e = await lockExchange(em, id);
    await moveExchange(em, e, 'received');
    if (e.productId) {
      await moveExchangeStock(em, { productId: e.productId, quantity: e.quantity, reason: 'return', orderId: e.orderId, exchangeId: e.id, note: `${e.number} received`, actorId });
      await em.query(`UPDATE order_lines SET restocked_quantity = LEAST(quantity, restocked_quantity + $2) WHERE id = $1`, [e.orderLineId, e.quantity]);
    }
    let refundedCents: number | undefined;
    if (e.settlement === 'refund-due') {
      const o = await lockOrder(em, { id: e.orderId });
      if (!o) throw AppError.notFound('The order');
      const amount = Math.min(-e.differenceCents, o.totalCents - o.refundedCents);
      const providerRefundId = await refundThroughProvider(em, provider, o, amount);
      if (e.kind === 'return') await em.query(`UPDATE order_lines SET refunded_quantity = LEAST(quantity, refunded_quantity + $2) WHERE id = $1`, [e.orderLineId, e.quantity]);
      await recordRefund(em, config, o, {
        providerRefundId,
        amountCents: amount,
        reason: e.kind === 'return' ? `Return ${e.number}` : `Exchange ${e.number}: the new rate costs less`,
        lines: e.kind === 'return' ? [{ orderLineId: e.orderLineId, quantity: e.quantity, restock: true }] : [],
        actorId,
      });
      e.refundId = (await em.getRepository(Refund).findOneByOrFail({ providerRefundId })).id;
      e.settlement = 'refunded';
      e.settledAt = new Date();
      refundedCents = amount;
    }
    if (e.kind === 'return') await moveExchange(em, e, 'refunded');
    else await em.getRepository(Exchange).save(e);
    await mailExchangeStep(em, config, e, 'received', refundedCents === undefined ? {} : { refundedCents });
    return toExchangeDto(em, e);
  });
}

/**
 * The replacement leaves: off the shelf through the stock ledger (never below zero), carrier and tracking recorded,
 * the rider mailed. Refused while the difference is owed. (The order's own pick-pack-ship is not involved: an
 * exchange ships one spring on its own.)
 */
export async function shipReplacement(config: Config, actorId: string, id: string, dto: ExchangeShipDto): Promise<ExchangeDto> {
  return AppDataSource.transaction(async (em) => {
    const e = await lockExchange(em, id);
    e.carrier = dto.carrier.trim();
    e.trackingNumber = dto.trackingNumber.trim();
    await moveExchange(em, e, 'shipped');
    await moveExchangeStock(em, { productId: e.replacementProductId!, quantity: -e.quantity, reason: 'sale', orderId: e.orderId, exchangeId: e.id, note: `${e.number} replacement shipped`, actorId });
    await mailExchangeStep(em, config, e, 'shipped');
    return toExchangeDto(em, e);
  });
}
