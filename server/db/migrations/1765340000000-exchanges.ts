import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Exchanges1765340000000 implements MigrationInterface {
  name = 'Exchanges1765340000000';

  async up(q: QueryRunner): Promise<void> {
    // The shop settings page owns this figure; added here only when that change has not added it already.
    await q.query(`CREATE SEQUENCE exchange_number_seq START 1001`);
    await q.query(`
      CREATE TABLE exchanges (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        number varchar(20) NOT NULL UNIQUE DEFAULT ('EX-' || nextval('exchange_number_seq')),
        kind varchar(10) NOT NULL CHECK (kind IN ('exchange', 'return')),
        state varchar(12) NOT NULL CHECK (state IN ('requested', 'approved', 'refused', 'received', 'shipped', 'refunded')),
        settlement varchar(20) NOT NULL DEFAULT 'none' CHECK (settlement IN ('none', 'awaiting-payment', 'paid', 'refund-due', 'refunded')),
        order_id uuid NOT NULL REFERENCES orders(id),
        order_line_id uuid NOT NULL REFERENCES order_lines(id),
        user_id uuid NOT NULL REFERENCES users(id),
        email varchar(254) NOT NULL,
        product_id uuid REFERENCES products(id),
        quantity int NOT NULL CHECK (quantity > 0),
        paid_unit_cents int NOT NULL CHECK (paid_unit_cents >= 0),
        replacement_product_id uuid REFERENCES products(id),
        replacement jsonb,
        difference_cents int NOT NULL DEFAULT 0,
        reason varchar(10) NOT NULL CHECK (reason IN ('too-soft', 'too-stiff', 'other')),
        reason_text text NOT NULL DEFAULT '',
        sag_check jsonb,
        staff_message text NOT NULL DEFAULT '',
        decided_by uuid REFERENCES users(id),
        payment_session_id varchar(255),
        payment_url text,
        payment_intent_id varchar(255),
        refund_id uuid,
        carrier varchar(60),
        tracking_number varchar(80),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        decided_at timestamptz,
        received_at timestamptz,
        settled_at timestamptz,
        shipped_at timestamptz,
        CHECK ((kind = 'exchange') = (replacement_product_id IS NOT NULL))
      )`);
    // One live exchange or return per order line; a refused one leaves room to ask again.
    await q.query(`CREATE UNIQUE INDEX exchanges_one_open_per_line ON exchanges (order_line_id) WHERE state <> 'refused'`);
    await q.query(`CREATE INDEX exchanges_user ON exchanges (user_id, created_at DESC)`);
    await q.query(`CREATE INDEX exchanges_state ON exchanges (state, reason)`);
    // Ledger rows written for an exchange point at it.
    await q.query(`ALTER TABLE stock_movements ADD CONSTRAINT stock_movements_exchange FOREIGN KEY (exchange_id) REFERENCES exchanges(id)`);
    await q.query(`CREATE UNIQUE INDEX exchanges_payment_session ON exchanges (payment_session_id) WHERE payment_session_id IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE stock_movements DROP CONSTRAINT stock_movements_exchange`);
    await q.query(`DROP TABLE exchanges`);
    await q.query(`DROP SEQUENCE exchange_number_seq`);
  }
}
