import express, { Router } from 'express';
import type { Config } from '../config';
import { AppError } from '../errors';
import { refundWholeOrder } from '../orders/refunds.service';
import { PaymentSignatureError, type PaymentProvider } from './payment-provider';
import { handlePaymentEvent } from './webhook.service';

/**
 * The provider's events. Mounted before the JSON parser: the signature covers the exact bytes sent, so the body is
 * read raw and only parsed once the signature matches.
 */
export function paymentWebhookRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.post('/', express.raw({ type: () => true, limit: '1mb' }), async (req, res) => {
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    let event;
    try {
      event = provider.verifyEvent(body, req.header('stripe-signature'));
    } catch (e) {
      if (e instanceof PaymentSignatureError) {
        req.log?.warn({ reason: e.message }, 'payment webhook with a bad signature refused');
        throw new AppError('validation', 'The signature of this event does not match.', { 'stripe-signature': 'does not match the body' });
      }
      throw e;
    }
    const result = await handlePaymentEvent(config, event);
    if (result.outcome === 'unknown-order') req.log?.warn({ eventId: event.id, type: event.type }, 'payment event for no order we know; acknowledged, nothing changed');
    else req.log?.info({ eventId: event.id, type: event.type, outcome: result.outcome, orderId: result.orderId }, 'payment event');
    if (result.outcome === 'paid-after-cancel' && result.orderId) {
      await refundWholeOrder(config, provider, result.orderId, { reason: 'Paid after the order had been cancelled.', restock: false, actorId: null }).catch((e: unknown) =>
        req.log?.error({ err: e, orderId: result.orderId }, 'refund of a payment that came after cancellation failed; refund it by hand'),
      );
    }
    res.json({ received: true, outcome: result.outcome });
  });
  return r;
}
