import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

/** A Checkout Session in the service's shape, plus the few private fields the stand-in needs (prefixed _). */
export interface SessionRecord {
  id: string;
  object: 'checkout.session';
  url: string | null;
  status: 'open' | 'complete' | 'expired';
  payment_status: 'paid' | 'unpaid' | 'no_payment_required';
  mode: 'payment';
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  customer_email: string | null;
  customer_details: { email: string | null } | null;
  metadata: Record<string, string>;
  payment_intent: string | null;
  expires_at: number;
  success_url: string;
  cancel_url: string | null;
  created: number;
  livemode: false;
  _account: string;
  _lineItems: { name: string; quantity: number; unit_amount: number }[];
  _paymentIntentMetadata: Record<string, string>;
}

export interface PaymentIntentRecord {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'requires_payment_method' | 'succeeded';
  metadata: Record<string, string>;
  latest_charge: string | null;
  last_payment_error: { code: string; decline_code: string; message: string } | null;
  created: number;
  livemode: false;
  _refunded: number;
  _session: string;
}

export interface EndpointRecord {
  id: string;
  account: string;
  url: string;
  secret: string;
}

export interface Delivery {
  eventId: string;
  endpointId: string;
  payload: string;
  attempt: number;
  nextAt: number;
}

export interface StandinState {
  sessions: Record<string, SessionRecord>;
  paymentIntents: Record<string, PaymentIntentRecord>;
  refunds: Record<string, Record<string, unknown>>;
  idempotency: Record<string, { fingerprint: string; status: number; body: unknown }>;
  endpoints: Record<string, EndpointRecord>;
  deliveries: Delivery[];
}

const empty = (): StandinState => ({ sessions: {}, paymentIntents: {}, refunds: {}, idempotency: {}, endpoints: {}, deliveries: [] });

/** State in memory, written to one JSON file shortly after each change so a restart picks up where it stopped. */
export class Store {
  state: StandinState;
  private timer: NodeJS.Timeout | undefined;
  private lastFlushMs = 0;

  constructor(private readonly file: string) {
    this.state = existsSync(file) ? { ...empty(), ...(JSON.parse(readFileSync(file, 'utf8')) as Partial<StandinState>) } : empty();
  }

  changed(): void {
    // The whole state is written each time, so under a rush of sessions it is written less often: at most a tenth of the time.
    this.timer ??= setTimeout(() => this.flush(), Math.max(250, this.lastFlushMs * 10));
  }

  flush(): void {
    clearTimeout(this.timer);
    this.timer = undefined;
    const t0 = performance.now();
    mkdirSync(dirname(this.file), { recursive: true });
    // Written beside and renamed, so a reader never sees half a file.
    writeFileSync(`${this.file}.tmp`, JSON.stringify(this.state));
    renameSync(`${this.file}.tmp`, this.file);
    this.lastFlushMs = performance.now() - t0;
  }
}
