/**
 * Where the money is taken. The stripe SDK implements it (stripe-provider.ts) against the real service or the local
 * stand-in (standins/payments); callers only create, read and expire hosted payment pages, refund and read events.
 */
export interface PaymentProvider {
  /** The same idempotency key always answers with the same session, so a retried checkout never opens two. */
  createCheckoutSession(input: CheckoutSessionInput, idempotencyKey: string): Promise<PaymentSession>;
  retrieveCheckoutSession(id: string): Promise<PaymentSession>;
  /** Closes an open payment page; an already closed one is not an error. */
  expireCheckoutSession(id: string): Promise<PaymentSession>;
  refund(input: RefundInput, idempotencyKey: string): Promise<ProviderRefund>;
  /** Checks the signature of a webhook body and parses it; throws PaymentSignatureError when it does not match. */
  verifyEvent(rawBody: Buffer, signatureHeader: string | undefined): ProviderEvent;
}

export interface CheckoutSessionInput {
  orderId: string;
  orderNumber: string;
  email: string;
  currency: string;
  lines: { name: string; sku: string; unitAmountCents: number; quantity: number }[];
  successUrl: string;
  cancelUrl: string;
  expiresAt: Date;
}

export interface PaymentSession {
  id: string;
  url: string | null;
  status: 'open' | 'complete' | 'expired';
  paymentStatus: 'paid' | 'unpaid' | 'no_payment_required';
  paymentIntentId: string | null;
  amountTotalCents: number | null;
  clientReferenceId: string | null;
}

export interface RefundInput {
  paymentIntentId: string;
  amountCents: number;
  orderId: string;
}

export interface ProviderRefund {
  id: string;
  amountCents: number;
  status: string;
}

/** The part of a provider event the shop reads. */
export interface ProviderEvent {
  id: string;
  type: string;
  object: Record<string, unknown>;
}

/** The provider could not be reached or did not answer in time: nothing was charged. */
export class PaymentUnavailableError extends Error {}
/** The provider refused the request (a 4xx); the message is the provider's. */
export class PaymentRefusedError extends Error {}
export class PaymentSignatureError extends Error {}
