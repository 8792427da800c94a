import type { EntityManager } from 'typeorm';
import type { ExchangeDto, ExchangeProposalDto, ExchangeReplacementDto, ExchangeProposalQueryDto, ExchangeRequestDto, ExchangeSagCheckDto } from '../../shared/commerce/exchange.dto';
import { exchangeDifferenceCents, exchangeWindowEnd, exchangeWindowOpen } from '../../shared/exchange-status';
import type { User } from '../accounts/User.entity';
import type { Config } from '../config';
import { sagCheck as runSagCheck } from '../calculations/calculations.service';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { Order } from '../orders/Order.entity';
import { OrderLine } from '../orders/OrderLine.entity';
import type { BikeCache } from '../recommendations/recommendations.service';
import { toExchangeDto, toExchangeDtos } from './exchange-dto';
import { mailExchangeStep } from './exchange-mail';
import { engineOptions, proposeReplacement } from './exchange-options';
import { Exchange } from './Exchange.entity';

/** The shop's exchange window in days (shop settings; 30 until set). */
export async function exchangeWindowDays(em: EntityManager): Promise<number> {
  const [row] = (await em.query(`SELECT exchange_window_days AS days FROM shop_settings WHERE id = 1`)) as { days: number }[];
  return row?.days ?? 30;
}

/** A line of one of the rider's own orders; any other line is a 404, whether it exists or not. */
async function ownLine(em: EntityManager, user: User, orderLineId: string): Promise<{ order: Order; line: OrderLine }> {
  const line = await em.getRepository(OrderLine).findOneBy({ id: orderLineId.toLowerCase() });
  const order = line ? await em.getRepository(Order).findOneBy({ id: line.orderId }) : null;
  if (!line || !order || order.userId !== user.id) throw AppError.notFound('The order line');
  return { order, line };
}

/** Why no request can be made for this line now; null when one can. */
async function blockedBy(em: EntityManager, order: Order, line: OrderLine, days: number): Promise<string | null> {
  if (!order.deliveredAt) return 'The order has not been delivered yet; exchanges and returns open on delivery.';
  if (!exchangeWindowOpen(order.deliveredAt, days)) return `Exchanges and returns close ${days} days after delivery; this order was delivered on ${order.deliveredAt.toISOString().slice(0, 10)}.`;
  if (line.quantity - line.refundedQuantity <= 0) return 'This line has already been refunded.';
  const [open] = (await em.query(`SELECT number FROM exchanges WHERE order_line_id = $1 AND state <> 'refused'`, [line.id])) as { number: string }[];
  if (open) return `You already asked about this spring (${open.number}).`;
  return null;
}

const boughtOf = (line: OrderLine) => ({ productId: line.productId, name: line.name, sku: line.sku, rateNPerMm: line.setup?.rateNPerMm ?? null, quantity: line.quantity - line.refundedQuantity, unitPriceCents: line.unitPriceCents });

/** What the request page offers: the engine's ok rate for the order's saved load, every other option, and whether the window is open. */
export async function proposal(cache: BikeCache, user: User, q: ExchangeProposalQueryDto): Promise<ExchangeProposalDto> {
  const em = AppDataSource.manager;
  const { order, line } = await ownLine(em, user, q.orderLineId);
  const days = await exchangeWindowDays(em);
  const engine = await engineOptions(em, cache, line);
  const bought = boughtOf(line);
  return {
    orderId: order.id,
    orderNumber: order.number,
    orderLineId: line.id,
    end: engine?.end ?? null,
    bought,
    targets: engine?.targets ?? null,
    currency: order.currency,
    proposed: engine ? proposeReplacement(engine.options, bought, q.reason) : null,
    options: engine?.options ?? [],
    windowEndsAt: exchangeWindowEnd(order.deliveredAt, days)?.toISOString() ?? null,
    blockedBy: await blockedBy(em, order, line, days),
  };
}

/** The sag check the rider attached, with the verdict worked out here by the shared engine (never the client's). */
function sagCheckOf(dto: ExchangeRequestDto, end: 'fork' | 'shock' | null): ExchangeSagCheckDto | null {
  if (!dto.sagCheck) return null;
  const want = end === 'fork' ? 'front' : end === 'shock' ? 'rear' : null;
  if (want && dto.sagCheck.end !== want) throw AppError.validation('The sag check is for the other end of the bike.', { 'sagCheck.end': `This spring is at the ${want}; attach a ${want} sag check.` });
  return { input: { ...dto.sagCheck }, result: runSagCheck(dto.sagCheck) };
}

/**
 * A rider asks to exchange a spring for another rate (the proposed one unless they choose another the engine judged
 * for their load) or to return it, within the window after delivery; the request and its mail commit together.
 */
export async function requestExchange(config: Config, cache: BikeCache, user: User, dto: ExchangeRequestDto): Promise<ExchangeDto> {
  const { order, line } = await ownLine(AppDataSource.manager, user, dto.orderLineId);
  const engine = dto.kind === 'exchange' ? await engineOptions(AppDataSource.manager, cache, line) : null;
  if (dto.kind === 'exchange' && !engine) throw AppError.validation('Only springs bought for a bike can be exchanged for another rate; return this part instead.', { kind: 'Only springs bought for a bike can be exchanged; choose a return.' });
  const sagCheck = sagCheckOf(dto, line.setup?.end ?? null);
  const bought = boughtOf(line);
  let replacement: ExchangeReplacementDto | null | undefined = null;
  if (engine) {
    const wanted = dto.replacementProductId?.toLowerCase();
    replacement = wanted ? engine.options.find((o) => o.productId === wanted) : proposeReplacement(engine.options, bought, dto.reason);
    if (!replacement) throw AppError.validation('Choose a spring the shop offers for this bike.', { replacementProductId: wanted ? 'Not a spring the shop offers for this bike at this end.' : 'The engine finds no other rate that suits this load; ask for a return, or contact the shop.' });
    if (replacement.productId === line.productId) throw AppError.validation('Choose a different rate from the one you have.', { replacementProductId: 'That is the spring you already have.' });
  }
  return AppDataSource.transaction(async (em) => {
    // The line is locked so two requests for it take turns; the second then sees the first.
    await em.query(`SELECT id FROM order_lines WHERE id = $1 FOR UPDATE`, [line.id]);
    const fresh = (await em.getRepository(OrderLine).findOneByOrFail({ id: line.id }));
    const why = await blockedBy(em, order, fresh, await exchangeWindowDays(em));
    if (why) throw new AppError('conflict', why, undefined, { reason: 'exchange-not-open' });
    // The replacement's price as the catalogue has it now, under the same lock order as every stock writer.
    if (replacement) {
      const [p] = (await em.query(`SELECT price_cents, active FROM products WHERE id = $1`, [replacement.productId])) as { price_cents: number; active: boolean }[];
      if (!p?.active) throw new AppError('conflict', `${replacement.name} is no longer sold; choose another rate.`);
      replacement = { ...replacement, priceCents: p.price_cents };
    }
    const quantity = fresh.quantity - fresh.refundedQuantity;
    const repo = em.getRepository(Exchange);
    const saved = await repo.save(
      repo.create({
        kind: dto.kind,
        state: 'requested',
        settlement: 'none',
        orderId: order.id,
        orderLineId: line.id,
        userId: user.id,
        email: order.email,
        productId: line.productId,
        quantity,
        paidUnitCents: line.unitPriceCents,
        replacementProductId: replacement?.productId ?? null,
        replacement,
        differenceCents: exchangeDifferenceCents(dto.kind, line.unitPriceCents, replacement?.priceCents ?? null, quantity),
        reason: dto.reason,
        reasonText: (dto.reasonText ?? '').trim(),
        sagCheck,
        staffMessage: '',
      }),
    );
    const e = await repo.findOneByOrFail({ id: saved.id });
    await mailExchangeStep(em, config, e, 'requested');
    return toExchangeDto(em, e);
  });
}

/** The signed-in rider's own exchanges and returns, newest first. */
export async function listOwnExchanges(user: User): Promise<ExchangeDto[]> {
  const rows = await AppDataSource.getRepository(Exchange).find({ where: { userId: user.id }, order: { createdAt: 'DESC' }, take: 100 });
  return toExchangeDtos(AppDataSource.manager, rows);
}

/** One of the rider's own exchanges; anyone else's is a 404. */
export async function viewOwnExchange(user: User, id: string): Promise<ExchangeDto> {
  const e = await AppDataSource.getRepository(Exchange).findOneBy({ id });
  if (!e || e.userId !== user.id) throw AppError.notFound('The exchange');
  return toExchangeDto(AppDataSource.manager, e);
}

