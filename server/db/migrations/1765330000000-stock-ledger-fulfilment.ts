import type { MigrationInterface, QueryRunner } from 'typeorm';

export class StockLedgerFulfilment1765330000000 implements MigrationInterface {
  name = 'StockLedgerFulfilment1765330000000';

  async up(q: QueryRunner): Promise<void> {
    // Every change of a product's on-hand count is one row here; the count is always the sum of its rows.
    await q.query(`
      CREATE TABLE stock_movements (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        product_id uuid NOT NULL REFERENCES products(id) ON DELETE CASCADE,
        quantity int NOT NULL CHECK (quantity <> 0),
        reason varchar(20) NOT NULL CHECK (reason IN ('sale', 'expiry', 'cancel', 'refund', 'receipt', 'return', 'adjustment')),
        order_id uuid REFERENCES orders(id) ON DELETE SET NULL,
        exchange_id uuid,
        delivery_ref varchar(60),
        note text NOT NULL DEFAULT '',
        actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
        stock_after int NOT NULL CHECK (stock_after >= 0),
        created_at timestamptz NOT NULL DEFAULT clock_timestamp()
      )`);
    await q.query(`CREATE INDEX stock_movements_product_idx ON stock_movements (product_id, created_at)`);
    await q.query(`CREATE INDEX stock_movements_order_idx ON stock_movements (order_id) WHERE order_id IS NOT NULL`);
    // What is already on the shelves opens each product's ledger.
    await q.query(`
      INSERT INTO stock_movements (product_id, quantity, reason, note, stock_after)
      SELECT id, stock_on_hand, 'adjustment', 'opening balance', stock_on_hand FROM products WHERE stock_on_hand > 0`);
    // Null: the shop's default threshold applies.
    await q.query(`ALTER TABLE products ADD COLUMN low_stock_threshold int CHECK (low_stock_threshold >= 0)`);

    // Picking and shipping per line: picked counts what is in the tote, shipped what has left in a parcel.
    await q.query(`ALTER TABLE order_lines ADD COLUMN picked_quantity int NOT NULL DEFAULT 0 CHECK (picked_quantity >= 0 AND picked_quantity <= quantity)`);
    await q.query(`ALTER TABLE order_lines ADD COLUMN shipped_quantity int NOT NULL DEFAULT 0 CHECK (shipped_quantity >= 0 AND shipped_quantity <= quantity)`);
    await q.query(`ALTER TABLE orders ADD COLUMN packed_by uuid REFERENCES users(id) ON DELETE SET NULL`);
    await q.query(`
      CREATE TABLE shipments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        order_id uuid NOT NULL REFERENCES orders(id) ON DELETE CASCADE,
        carrier varchar(60) NOT NULL,
        tracking_number varchar(60) NOT NULL,
        lines jsonb NOT NULL,
        back_ordered boolean NOT NULL DEFAULT false,
        shipped_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp()
      )`);
    await q.query(`CREATE INDEX shipments_order_idx ON shipments (order_id, created_at)`);
    await q.query(`CREATE INDEX orders_fulfilment_queue_idx ON orders (fulfilment_status, paid_at) WHERE payment_status = 'paid'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX IF EXISTS orders_fulfilment_queue_idx`);
    await q.query(`DROP TABLE shipments`);
    await q.query(`ALTER TABLE orders DROP COLUMN packed_by`);
    await q.query(`ALTER TABLE order_lines DROP COLUMN shipped_quantity`);
    await q.query(`ALTER TABLE order_lines DROP COLUMN picked_quantity`);
    await q.query(`ALTER TABLE products DROP COLUMN low_stock_threshold`);
    await q.query(`DROP TABLE stock_movements`);
  }
}
