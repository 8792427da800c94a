import { Brackets } from 'typeorm';
import type { Page } from '../../shared/catalogue';
import type { OrderDto, OrderSummaryDto, StaffOrderQueryDto } from '../../shared/commerce/order.dto';
import { mayRiderCancel } from '../../shared/order-status';
import type { User } from '../accounts/User.entity';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import type { PaymentProvider } from '../payments/payment-provider';
import { isOrderAccessToken } from './order-access';
import { toOrderDto, toOrderSummaryDto } from './order-dto';
import { orderMail } from './order-mail';
import { lockOrder, moveOrder } from './order-moves';
import { releaseStock } from './order-stock';
import { Order } from './Order.entity';
import { refundThroughProvider, recordRefund } from './refunds.service';

async function summaries(orders: Order[]): Promise<OrderSummaryDto[]> {
  if (!orders.length) return [];
  const counts = (await AppDataSource.query(`SELECT order_id, sum(quantity)::int AS n FROM order_lines WHERE order_id = ANY($1::uuid[]) GROUP BY order_id`, [orders.map((o) => o.id)])) as { order_id: string; n: number }[];
  const n = new Map(counts.map((c) => [c.order_id, c.n]));
  return orders.map((o) => toOrderSummaryDto(o, n.get(o.id) ?? 0));
}

/** The signed-in rider's own orders, newest first. */
export async function listOwnOrders(user: User): Promise<OrderSummaryDto[]> {
  return summaries(await AppDataSource.getRepository(Order).find({ where: { userId: user.id }, order: { createdAt: 'DESC' }, take: 100 }));
}

/** An order for its owner, or for whoever holds the order's link (a guest's token); anyone else gets a 404. */
export async function viewOrder(config: Config, viewer: User | undefined, orderId: string, token: unknown): Promise<OrderDto> {
  const o = await AppDataSource.getRepository(Order).findOneBy({ id: orderId });
  const mayView = o && ((viewer && o.userId === viewer.id) || isOrderAccessToken(config, o.id, token));
  if (!o || !mayView) throw AppError.notFound('The order');
  return toOrderDto(AppDataSource.manager, o);
}

/**
 * The buyer cancels before the order is packed: stock back, anything paid refunded through the provider, all in
 * one transaction with the order locked; an open payment page is closed afterwards.
 */
export async function cancelByRider(config: Config, provider: PaymentProvider, viewer: User | undefined, orderId: string, token: unknown): Promise<OrderDto> {
  await viewOrder(config, viewer, orderId, token);
  const { dto, sessionToClose } = await AppDataSource.transaction(async (em) => {
    const o = (await lockOrder(em, { id: orderId }))!;
    if (!mayRiderCancel(o)) throw new AppError('conflict', o.fulfilmentStatus !== 'unfulfilled' ? `Order ${o.number} is already packed; contact the shop to return it.` : `Order ${o.number} is already ${o.status}.`);
    await releaseStock(em, o, { reason: 'cancel', actorId: viewer?.id ?? null });
    const paid = o.paymentStatus === 'paid' || o.paymentStatus === 'partially-refunded';
    await moveOrder(em, o, { status: 'cancelled' }, { cancelReason: 'rider-cancelled' });
    if (paid) {
      const amount = o.totalCents - o.refundedCents;
      const providerRefundId = await refundThroughProvider(em, provider, o, amount);
      await recordRefund(em, config, o, { providerRefundId, amountCents: amount, reason: 'Cancelled by the buyer before packing.', lines: [], actorId: viewer?.id ?? null });
    }
    await orderMail.cancelled(em, config, o);
    return { dto: await toOrderDto(em, o), sessionToClose: paid ? null : o.paymentSessionId };
  });
  if (sessionToClose) await provider.expireCheckoutSession(sessionToClose).catch(() => undefined);
  return dto;
}

/** Every order for the staff, filtered by any of the three states and by number, e-mail or name. */
export async function listOrdersForStaff(q: StaffOrderQueryDto): Promise<Page<OrderSummaryDto>> {
  const page = q.page ?? 1;
  const pageSize = q.pageSize ?? 25;
  const qb = AppDataSource.getRepository(Order).createQueryBuilder('o').orderBy('o.createdAt', 'DESC').skip((page - 1) * pageSize).take(pageSize);
  if (q.status) qb.andWhere('o.status = :status', { status: q.status });
  if (q.paymentStatus) qb.andWhere('o.paymentStatus = :ps', { ps: q.paymentStatus });
  if (q.fulfilmentStatus) qb.andWhere('o.fulfilmentStatus = :fs', { fs: q.fulfilmentStatus });
  const text = q.q?.trim();
  if (text) {
    const like = `%${text.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    qb.andWhere(new Brackets((w) => w.where('lower(o.number) LIKE :like', { like }).orWhere('o.email LIKE :like', { like }).orWhere('lower(o.customerName) LIKE :like', { like })));
  }
  const [rows, total] = await qb.getManyAndCount();
  return { items: await summaries(rows), total, page, pageSize };
}

export async function viewOrderForStaff(orderId: string): Promise<OrderDto> {
  const o = await AppDataSource.getRepository(Order).findOneBy({ id: orderId });
  if (!o) throw AppError.notFound('The order');
  return toOrderDto(AppDataSource.manager, o);
}
