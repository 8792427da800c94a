import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Commerce1764982800000 implements MigrationInterface {
  name = 'Commerce1764982800000';

  async up(q: QueryRunner): Promise<void> {
    // One row: the shop's own figures. The admin pages will edit it; until then the seed and the defaults set it.
    await q.query(`
      CREATE TABLE shop_settings (
        id smallint PRIMARY KEY DEFAULT 1 CHECK (id = 1),
        shop_name varchar(120) NOT NULL,
        shop_address text NOT NULL,
        currency char(3) NOT NULL DEFAULT 'EUR',
        vat_rate_bp int NOT NULL CHECK (vat_rate_bp BETWEEN 0 AND 5000),
        shipping_flat_cents int NOT NULL CHECK (shipping_flat_cents >= 0),
        free_shipping_threshold_cents int NOT NULL CHECK (free_shipping_threshold_cents >= 0),
        reservation_minutes int CHECK (reservation_minutes BETWEEN 1 AND 1440),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    // A bike, its load and the engine's figures for the springs chosen: kept unchanged by the cart and orders that point at it.
    await q.query(`
      CREATE TABLE spring_sets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        fitment_id uuid REFERENCES fitments(id) ON DELETE SET NULL,
        bike_label varchar(200) NOT NULL,
        riding_style varchar(20) NOT NULL,
        request jsonb NOT NULL,
        loads jsonb NOT NULL,
        setup jsonb NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE carts (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid UNIQUE REFERENCES users(id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE cart_lines (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        cart_id uuid NOT NULL REFERENCES carts(id) ON DELETE CASCADE,
        product_id uuid NOT NULL REFERENCES products(id) ON DELETE CASCADE,
        quantity int NOT NULL CHECK (quantity > 0),
        unit_price_cents int NOT NULL CHECK (unit_price_cents >= 0),
        spring_set_id uuid REFERENCES spring_sets(id) ON DELETE SET NULL,
        verdict varchar(20),
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE NULLS NOT DISTINCT (cart_id, product_id, spring_set_id)
      )`);
    await q.query(`CREATE SEQUENCE order_number_seq START 1001`);
    await q.query(`
      CREATE TABLE orders (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        number varchar(20) NOT NULL UNIQUE DEFAULT ('LL-' || nextval('order_number_seq')),
        user_id uuid REFERENCES users(id) ON DELETE SET NULL,
        cart_id uuid,
        email varchar(254) NOT NULL,
        customer_name varchar(120) NOT NULL,
        shipping_address jsonb NOT NULL,
        status varchar(20) NOT NULL CHECK (status IN ('pending', 'confirmed', 'completed', 'cancelled')),
        payment_status varchar(20) NOT NULL CHECK (payment_status IN ('awaiting', 'paid', 'failed', 'refunded', 'partially-refunded')),
        fulfilment_status varchar(20) NOT NULL CHECK (fulfilment_status IN ('unfulfilled', 'packed', 'partially-shipped', 'shipped', 'delivered')),
        cancel_reason varchar(30),
        currency char(3) NOT NULL,
        subtotal_cents int NOT NULL CHECK (subtotal_cents >= 0),
        shipping_cents int NOT NULL CHECK (shipping_cents >= 0),
        vat_cents int NOT NULL CHECK (vat_cents >= 0),
        total_cents int NOT NULL CHECK (total_cents >= 0),
        vat_rate_bp int NOT NULL,
        refunded_cents int NOT NULL DEFAULT 0 CHECK (refunded_cents >= 0 AND refunded_cents <= total_cents),
        payment_session_id varchar(255) UNIQUE,
        payment_url text,
        payment_intent_id varchar(255),
        payment_failure text,
        reserved_until timestamptz NOT NULL,
        stock_held boolean NOT NULL DEFAULT true,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        paid_at timestamptz,
        payment_failed_at timestamptz,
        confirmed_at timestamptz,
        cancelled_at timestamptz,
        refunded_at timestamptz,
        packed_at timestamptz,
        shipped_at timestamptz,
        delivered_at timestamptz,
        completed_at timestamptz
      )`);
    await q.query(`CREATE INDEX orders_pending_until ON orders (reserved_until) WHERE status = 'pending' AND stock_held`);
    await q.query(`CREATE INDEX orders_user ON orders (user_id, created_at DESC)`);
    // A second checkout of a cart finds the first one's unpaid order through this.
    await q.query(`CREATE INDEX orders_cart_pending ON orders (cart_id) WHERE status = 'pending'`);
    await q.query(`CREATE INDEX orders_payment_intent ON orders (payment_intent_id) WHERE payment_intent_id IS NOT NULL`);
    await q.query(`CREATE INDEX orders_created ON orders (created_at DESC)`);
    await q.query(`
      CREATE TABLE order_lines (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        order_id uuid NOT NULL REFERENCES orders(id) ON DELETE CASCADE,
        position int NOT NULL,
        product_id uuid REFERENCES products(id) ON DELETE SET NULL,
        sku varchar(40) NOT NULL,
        name varchar(120) NOT NULL,
        kind varchar(20) NOT NULL,
        unit_price_cents int NOT NULL CHECK (unit_price_cents >= 0),
        quantity int NOT NULL CHECK (quantity > 0),
        line_total_cents int NOT NULL CHECK (line_total_cents >= 0),
        refunded_quantity int NOT NULL DEFAULT 0 CHECK (refunded_quantity BETWEEN 0 AND quantity),
        restocked_quantity int NOT NULL DEFAULT 0 CHECK (restocked_quantity BETWEEN 0 AND quantity),
        spring_set_id uuid REFERENCES spring_sets(id) ON DELETE SET NULL,
        setup jsonb,
        UNIQUE (order_id, position)
      )`);
    // Each provider event is recorded once; its insert and the change it causes commit together.
    await q.query(`
      CREATE TABLE payment_events (
        id varchar(255) PRIMARY KEY,
        type varchar(80) NOT NULL,
        order_id uuid,
        outcome varchar(40) NOT NULL,
        received_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE refunds (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        order_id uuid NOT NULL REFERENCES orders(id) ON DELETE CASCADE,
        provider_refund_id varchar(255) NOT NULL UNIQUE,
        amount_cents int NOT NULL CHECK (amount_cents > 0),
        reason text NOT NULL DEFAULT '',
        lines jsonb NOT NULL DEFAULT '[]',
        actor_id uuid,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX refunds_order ON refunds (order_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE refunds`);
    await q.query(`DROP TABLE payment_events`);
    await q.query(`DROP TABLE order_lines`);
    await q.query(`DROP TABLE orders`);
    await q.query(`DROP SEQUENCE order_number_seq`);
    await q.query(`DROP TABLE cart_lines`);
    await q.query(`DROP TABLE carts`);
    await q.query(`DROP TABLE spring_sets`);
    await q.query(`DROP TABLE shop_settings`);
  }
}
