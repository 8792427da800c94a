import type { OrderDto } from '../../shared/commerce/order.dto';
import { mayStaffCancel } from '../../shared/order-status';
import { recordAudit } from '../audit/audit.service';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { PaymentUnavailableError, type PaymentProvider } from '../payments/payment-provider';
import { toOrderDto } from './order-dto';
import { orderMail } from './order-mail';
import { lockOrder, moveOrder } from './order-moves';
import { releaseStock } from './order-stock';
import type { Order } from './Order.entity';

const states = (o: Order) => ({ status: o.status, paymentStatus: o.paymentStatus, fulfilmentStatus: o.fulfilmentStatus, cancelReason: o.cancelReason, stockHeld: o.stockHeld });

/**
 * Staff cancel an order still waiting for its money: its payment page is closed first (a page paid at that very
 * moment says so, and the order is then refused as paid), its stock goes back through the ledger, the order is
 * cancelled, the buyer's mail queued and the change audited, in one transaction with the order locked.
 */
export async function cancelUnpaidByStaff(config: Config, provider: PaymentProvider, actorId: string, orderId: string): Promise<OrderDto> {
  return AppDataSource.transaction(async (em) => {
    const o = await lockOrder(em, { id: orderId });
    if (!o) throw AppError.notFound('The order');
    const paid = () =>
      new AppError('conflict', `Order ${o.number} is paid, so it is not cancelled here: refund it instead, and the money goes back to the buyer.`, undefined, { reason: 'paid' });
    if (!mayStaffCancel(o)) {
      if (o.paymentStatus !== 'awaiting' && o.paymentStatus !== 'failed') throw paid();
      throw new AppError('conflict', `Order ${o.number} is already ${o.status}; only a pending order that is not paid can be cancelled.`, undefined, { reason: 'not-pending' });
    }
    if (o.paymentSessionId) {
      try {
        const session = await provider.expireCheckoutSession(o.paymentSessionId);
        if (session.status === 'complete' || session.paymentStatus === 'paid') throw paid();
      } catch (e) {
        if (e instanceof PaymentUnavailableError) throw new AppError('unavailable', 'The payment service cannot be reached to close the payment page, so the order is not cancelled. Please try again shortly.');
        throw e;
      }
    }
    const before = states(o);
    await releaseStock(em, o, { reason: 'cancel', actorId });
    await moveOrder(em, o, { status: 'cancelled' }, { cancelReason: 'staff-cancelled' });
    await orderMail.cancelled(em, config, o);
    await recordAudit(em, { actorId, entityType: 'order', entityId: o.id, action: 'update', before, after: states(o) });
    return toOrderDto(em, o);
  });
}
