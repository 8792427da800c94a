import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Catalogue1764720000000 implements MigrationInterface {
  name = 'Catalogue1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE bikes (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        make varchar(60) NOT NULL,
        model varchar(60) NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX bikes_make_model_ci ON bikes (lower(make), lower(model))`);
    // Quantities are double precision (SI units) so they arrive as numbers, not numeric strings.
    await q.query(`
      CREATE TABLE fitments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        bike_id uuid NOT NULL REFERENCES bikes(id) ON DELETE RESTRICT,
        variant varchar(60) NOT NULL DEFAULT '',
        year_from int NOT NULL,
        year_to int NOT NULL,
        mass_input varchar(10) NOT NULL CHECK (mass_input IN ('sprung', 'wet')),
        front_sprung_mass_kg double precision NOT NULL,
        rear_sprung_mass_kg double precision NOT NULL,
        wet_mass_kg double precision,
        front_static_share_pct double precision,
        front_unsprung_mass_kg double precision,
        rear_unsprung_mass_kg double precision,
        rated_load_kg double precision NOT NULL,
        wheelbase_mm double precision NOT NULL,
        load_stations jsonb NOT NULL,
        rear_leverage_ratio double precision,
        rear_leverage_curve jsonb,
        rear_wheel_travel_mm double precision NOT NULL,
        shock_stroke_mm double precision NOT NULL,
        rear_preload_min_mm double precision NOT NULL,
        rear_preload_max_mm double precision NOT NULL,
        rear_adjuster_pitch_mm double precision NOT NULL,
        shock_spring_inner_diameter_mm double precision NOT NULL,
        shock_spring_free_length_min_mm double precision NOT NULL,
        shock_spring_free_length_max_mm double precision NOT NULL,
        fork_angle_deg double precision NOT NULL,
        fork_travel_mm double precision NOT NULL,
        fork_spring_count int NOT NULL,
        fork_preload_min_mm double precision NOT NULL,
        fork_preload_max_mm double precision NOT NULL,
        fork_adjuster_pitch_mm double precision,
        fork_spring_inner_diameter_mm double precision NOT NULL,
        fork_spring_free_length_min_mm double precision NOT NULL,
        fork_spring_free_length_max_mm double precision NOT NULL,
        sag jsonb NOT NULL,
        stock_fork_rate_n_per_mm double precision NOT NULL,
        stock_fork_free_length_mm double precision NOT NULL,
        stock_shock_rate_n_per_mm double precision NOT NULL,
        stock_shock_free_length_mm double precision NOT NULL,
        torques jsonb NOT NULL DEFAULT '[]',
        tools jsonb NOT NULL DEFAULT '[]',
        notes text NOT NULL DEFAULT '',
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK (year_to >= year_from),
        CHECK ((rear_leverage_ratio IS NULL) <> (rear_leverage_curve IS NULL))
      )`);
    await q.query(`CREATE UNIQUE INDEX fitments_variant_years ON fitments (bike_id, lower(variant), year_from)`);
    await q.query(`
      CREATE TABLE products (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        sku varchar(40) NOT NULL UNIQUE,
        name varchar(120) NOT NULL,
        kind varchar(20) NOT NULL CHECK (kind IN ('spring', 'adapter', 'tool', 'accessory')),
        description text NOT NULL DEFAULT '',
        price_cents int NOT NULL CHECK (price_cents >= 0),
        currency char(3) NOT NULL DEFAULT 'EUR',
        stock_on_hand int NOT NULL DEFAULT 0 CHECK (stock_on_hand >= 0),
        bin_location varchar(20) NOT NULL DEFAULT '',
        active boolean NOT NULL DEFAULT true,
        spring_end varchar(10) CHECK (spring_end IN ('fork', 'shock')),
        rate_n_per_mm double precision,
        free_length_mm double precision,
        inner_diameter_mm double precision,
        outer_diameter_mm double precision,
        wire_diameter_mm double precision,
        total_coils double precision,
        end_type varchar(20),
        material varchar(40),
        solid_length_mm double precision,
        computed_rate_n_per_mm double precision,
        computed_solid_length_mm double precision,
        spring_index double precision,
        active_coils double precision,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK ((kind = 'spring') = (spring_end IS NOT NULL))
      )`);
    await q.query(`CREATE INDEX products_spring_end_rate ON products (spring_end, rate_n_per_mm) WHERE kind = 'spring'`);
    await q.query(`
      CREATE TABLE product_images (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        product_id uuid NOT NULL REFERENCES products(id) ON DELETE CASCADE,
        file_name varchar(100) NOT NULL,
        content_type varchar(50) NOT NULL,
        size_bytes int NOT NULL,
        position int NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX product_images_product ON product_images (product_id, position)`);
    await q.query(`
      CREATE TABLE spring_fit_overrides (
        fitment_id uuid NOT NULL REFERENCES fitments(id) ON DELETE CASCADE,
        product_id uuid NOT NULL REFERENCES products(id) ON DELETE CASCADE,
        fits boolean NOT NULL,
        note varchar(500) NOT NULL DEFAULT '',
        PRIMARY KEY (fitment_id, product_id)
      )`);
    await q.query(`
      CREATE TABLE adapter_needs (
        fitment_id uuid NOT NULL REFERENCES fitments(id) ON DELETE CASCADE,
        spring_id uuid NOT NULL REFERENCES products(id) ON DELETE CASCADE,
        adapter_id uuid NOT NULL REFERENCES products(id) ON DELETE RESTRICT,
        quantity int NOT NULL CHECK (quantity BETWEEN 1 AND 10),
        PRIMARY KEY (fitment_id, spring_id, adapter_id)
      )`);
    await q.query(`CREATE INDEX adapter_needs_adapter ON adapter_needs (adapter_id)`);
    await q.query(`
      CREATE TABLE audit_log (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        at timestamptz NOT NULL DEFAULT clock_timestamp(),
        actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
        entity_type varchar(20) NOT NULL,
        entity_id uuid NOT NULL,
        action varchar(10) NOT NULL CHECK (action IN ('create', 'update', 'delete', 'import')),
        before jsonb,
        after jsonb
      )`);
    await q.query(`CREATE INDEX audit_log_entity ON audit_log (entity_type, entity_id, at DESC)`);
    await q.query(`CREATE INDEX audit_log_at ON audit_log (at DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE audit_log`);
    await q.query(`DROP TABLE adapter_needs`);
    await q.query(`DROP TABLE spring_fit_overrides`);
    await q.query(`DROP TABLE product_images`);
    await q.query(`DROP TABLE products`);
    await q.query(`DROP TABLE fitments`);
    await q.query(`DROP TABLE bikes`);
  }
}
