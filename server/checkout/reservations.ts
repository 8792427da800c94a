import type { EntityManager } from 'typeorm';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { orderMail } from '../orders/order-mail';
import { lockOrder, moveOrder } from '../orders/order-moves';
import { releaseStock } from '../orders/order-stock';
import type { Order } from '../orders/Order.entity';
import type { PaymentProvider } from '../payments/payment-provider';

/**
 * Ends an unpaid reservation: stock back, order cancelled as expired, the buyer told. The sweeper and the provider's
 * expiry event both come here with the order locked, so whichever is first does it and the other finds nothing to do.
 */
export async function expireReservation(em: EntityManager, config: Config, order: Order): Promise<boolean> {
  if (order.status !== 'pending' || order.paymentStatus === 'paid') return false;
  await releaseStock(em, order, { reason: 'expiry', actorId: null });
  await moveOrder(em, order, { status: 'cancelled' }, { cancelReason: 'expired' });
  await orderMail.cancelled(em, config, order);
  return true;
}

/** Expires every reservation past its time, one order per transaction; several app servers can run it at once. */
export async function sweepReservations(config: Config, provider: PaymentProvider, now = new Date()): Promise<number> {
  let done = 0;
  for (;;) {
    const session = await AppDataSource.transaction(async (em) => {
      const [row] = (await em.query(
        `SELECT id FROM orders WHERE status = 'pending' AND stock_held AND reserved_until <= $1 ORDER BY reserved_until LIMIT 1 FOR UPDATE SKIP LOCKED`,
        [now],
      )) as { id: string }[];
      if (!row) return undefined;
      const o = (await lockOrder(em, { id: row.id }))!;
      await expireReservation(em, config, o);
      return { sessionId: o.paymentSessionId };
    });
    if (!session) return done;
    done += 1;
    // Closes the payment page too; a page paid at this very moment is refunded by the webhook (paid after cancel).
    if (session.sessionId) await provider.expireCheckoutSession(session.sessionId).catch(() => undefined);
  }
}

/** Runs the sweep on a timer in each app server; stops with the returned function. */
export function startReservationSweeper(config: Config, provider: PaymentProvider, log: (msg: string, err?: unknown) => void): () => void {
  if (config.reservationSweepMs <= 0) return () => undefined;
  let running = false;
  const timer = setInterval(() => {
    if (running || !AppDataSource.isInitialized) return;
    running = true;
    sweepReservations(config, provider)
      .then((n) => n && log(`expired ${n} unpaid reservation(s)`))
      .catch((e: unknown) => log('reservation sweep failed', e))
      .finally(() => (running = false));
  }, config.reservationSweepMs);
  timer.unref();
  return () => clearInterval(timer);
}
