import type { EntityManager } from 'typeorm';
import type { OrderDto, RefundDto } from '../../shared/commerce/order.dto';
import { lineTotalCents, sumCents } from '../../shared/money';
import { mayRefund } from '../../shared/order-status';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { PaymentRefusedError, PaymentUnavailableError, type PaymentProvider } from '../payments/payment-provider';
import { toOrderDto } from './order-dto';
import { orderMail } from './order-mail';
import { lockOrder, moveOrder } from './order-moves';
import { releaseStock } from './order-stock';
import { recordStockMovement } from '../stock/stock-ledger';
import type { Order } from './Order.entity';
import { OrderLine } from './OrderLine.entity';
import { Refund, type RefundLine } from './Refund.entity';

/** Gives money back through the provider; the key is the order and its refund count, so a retry never refunds twice. */
export async function refundThroughProvider(em: EntityManager, provider: PaymentProvider, o: Order, amountCents: number): Promise<string> {
  if (!o.paymentIntentId) throw new AppError('conflict', `Order ${o.number} has no payment to refund.`);
  const [{ n }] = (await em.query(`SELECT count(*)::int AS n FROM refunds WHERE order_id = $1`, [o.id])) as [{ n: number }];
  try {
    const r = await provider.refund({ paymentIntentId: o.paymentIntentId, amountCents, orderId: o.id }, `refund:${o.id}:${n + 1}`);
    return r.id;
  } catch (e) {
    if (e instanceof PaymentUnavailableError) throw new AppError('unavailable', 'The payment service cannot be reached, so nothing was refunded. Please try again shortly.');
    if (e instanceof PaymentRefusedError) throw new AppError('conflict', `The payment service refused the refund: ${e.message}`);
    throw e;
  }
}

/** Records a refund made and moves the payment to refunded or partially refunded. */
export async function recordRefund(em: EntityManager, config: Config, o: Order, r: { providerRefundId: string; amountCents: number; reason: string; lines: RefundLine[]; actorId: string | null }): Promise<void> {
  const saved = await em.getRepository(Refund).save(em.getRepository(Refund).create({ orderId: o.id, ...r }));
  o.refundedCents += r.amountCents;
  await moveOrder(em, o, { paymentStatus: o.refundedCents >= o.totalCents ? 'refunded' : 'partially-refunded' });
  await orderMail.refunded(em, config, o, saved.id, r.amountCents);
}

/**
 * A refund the provider reports (charge.refunded): `amountRefundedCents` is everything refunded on the charge so far.
 * Refunds the shop made itself are already recorded (their ids are known and counted in refundedCents), so only what
 * goes beyond them is recorded, once, as made on the provider's side, with its mail; stock stays where it is, since
 * no goods came back. The order is locked by the caller.
 * @returns whether anything new was recorded
 */
export async function recordProviderRefund(em: EntityManager, config: Config, o: Order, charge: { amountRefundedCents: number; refundIds: string[] }): Promise<boolean> {
  if (!mayRefund(o)) return false;
  const extra = Math.min(charge.amountRefundedCents, o.totalCents) - o.refundedCents;
  if (extra <= 0) return false;
  const known = charge.refundIds.length
    ? ((await em.query(`SELECT provider_refund_id FROM refunds WHERE provider_refund_id = ANY($1)`, [charge.refundIds])) as { provider_refund_id: string }[]).map((r) => r.provider_refund_id)
    : [];
  // The provider lists a charge's refunds newest first; without the list, the running total names this one.
  const providerRefundId = charge.refundIds.find((id) => !known.includes(id)) ?? `external:${o.paymentIntentId}:${charge.amountRefundedCents}`;
  await recordRefund(em, config, o, { providerRefundId, amountCents: extra, reason: 'Refunded on the payment service, outside the shop.', lines: [], actorId: null });
  return true;
}

/** Puts returned units back on the shelf and counts them on their line, so a later release never counts them twice. */
async function restockLine(em: EntityManager, line: OrderLine, quantity: number, actorId: string | null): Promise<void> {
  if (!line.productId || quantity <= 0) return;
  await recordStockMovement(em, { productId: line.productId, quantity, reason: 'refund', orderId: line.orderId, actorId });
  await em.query(`UPDATE order_lines SET restocked_quantity = restocked_quantity + $2 WHERE id = $1`, [line.id, quantity]);
}

/** Whole-order refund: what is left of the total; before packing the order is also cancelled and its stock returns. */
export async function refundWholeOrder(config: Config, provider: PaymentProvider, orderId: string, opts: { reason: string; restock: boolean; actorId: string | null }): Promise<OrderDto> {
  return AppDataSource.transaction(async (em) => {
    const o = await lockOrder(em, { id: orderId });
    if (!o) throw AppError.notFound('The order');
    if (!mayRefund(o)) throw new AppError('conflict', `Order ${o.number} has no payment left to refund (payment ${o.paymentStatus}).`);
    const amount = o.totalCents - o.refundedCents;
    const providerRefundId = await refundThroughProvider(em, provider, o, amount);
    const lines = await em.getRepository(OrderLine).find({ where: { orderId: o.id }, order: { productId: 'ASC' } });
    if (o.fulfilmentStatus === 'unfulfilled' && o.status !== 'cancelled') {
      await releaseStock(em, o, { reason: 'refund', actorId: opts.actorId });
      await moveOrder(em, o, { status: 'cancelled' }, { cancelReason: 'refunded' });
    } else if (opts.restock) {
      for (const l of lines) await restockLine(em, l, l.quantity - l.restockedQuantity, opts.actorId);
    }
    await em.query(`UPDATE order_lines SET refunded_quantity = quantity WHERE order_id = $1`, [o.id]);
    await recordRefund(em, config, o, {
      providerRefundId,
      amountCents: amount,
      reason: opts.reason,
      lines: lines.map((l) => ({ orderLineId: l.id, quantity: l.quantity - l.refundedQuantity, restock: opts.restock })),
      actorId: opts.actorId,
    });
    return toOrderDto(em, o);
  });
}

/** Staff refund a whole order, or some units of some lines (their unit price each; shipping only with the whole order). */
export async function refundOrder(config: Config, provider: PaymentProvider, actorId: string, orderId: string, dto: RefundDto): Promise<OrderDto> {
  const reason = (dto.reason ?? '').trim();
  if (!dto.lines) return refundWholeOrder(config, provider, orderId, { reason, restock: dto.restock ?? false, actorId });
  return AppDataSource.transaction(async (em) => {
    const o = await lockOrder(em, { id: orderId });
    if (!o) throw AppError.notFound('The order');
    if (!mayRefund(o)) throw new AppError('conflict', `Order ${o.number} has no payment left to refund (payment ${o.paymentStatus}).`);
    const lines = await em.getRepository(OrderLine).find({ where: { orderId: o.id } });
    const problems: Record<string, string> = {};
    const picked = dto.lines!.map((r, i) => {
      const line = lines.find((l) => l.id === r.orderLineId.toLowerCase());
      if (!line) problems[`lines.${i}.orderLineId`] = 'Not a line of this order.';
      else if (r.quantity > line.quantity - line.refundedQuantity) problems[`lines.${i}.quantity`] = `At most ${line.quantity - line.refundedQuantity} of this line are left to refund.`;
      return { r, line: line! };
    });
    if (new Set(dto.lines!.map((l) => l.orderLineId.toLowerCase())).size !== dto.lines!.length) problems.lines = 'Name each line once.';
    if (Object.keys(problems).length) throw AppError.validation(Object.values(problems)[0]!, problems);
    const amount = Math.min(sumCents(picked.map(({ r, line }) => lineTotalCents(line.unitPriceCents, r.quantity))), o.totalCents - o.refundedCents);
    const providerRefundId = await refundThroughProvider(em, provider, o, amount);
    for (const { r, line } of picked.sort((a, b) => ((a.line.productId ?? '') < (b.line.productId ?? '') ? -1 : 1))) {
      await em.query(`UPDATE order_lines SET refunded_quantity = refunded_quantity + $2 WHERE id = $1`, [line.id, r.quantity]);
      if (r.restock) await restockLine(em, line, Math.min(r.quantity, line.quantity - line.restockedQuantity), actorId);
    }
    await recordRefund(em, config, o, { providerRefundId, amountCents: amount, reason, lines: picked.map(({ r }) => ({ orderLineId: r.orderLineId, quantity: r.quantity, restock: r.restock })), actorId });
    return toOrderDto(em, o);
  });
}
