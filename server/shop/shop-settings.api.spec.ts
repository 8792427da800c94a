import { describe, expect, it } from 'vitest';
import { shopSettingRanges } from '../../shared/admin/shop-settings';
import { requestPasswordReset } from '../accounts/accounts.service';
import { AppDataSource } from '../db/data-source';
import { createUser, testApp, userWithToken } from '../test/factories';
import { shopSettingsAuditId } from './shop-settings-admin.service';

const valid = {
  shopName: 'Coilyard Test Works',
  shopAddress: '3 Rebound Yard, 20999 Westbrook',
  currency: 'EUR',
  vatRateBasisPoints: 1900,
  shippingFlatCents: 495,
  freeShippingThresholdCents: 12_000,
  reservationMinutes: 45,
  exchangeWindowDays: 21,
  lowStockThreshold: 4,
};

async function admin() {
  const t = testApp();
  return { ...t, admin: await userWithToken(t.config, 'admin') };
}

describe('shop settings', () => {
  it('an admin reads the settings, saves every field and reads back what was saved', async () => {
    const { http, admin: a } = await admin();
    const before = await http.get('/api/admin/shop-settings').set(a.auth).expect(200);
    expect(before.body).toMatchObject({ currency: 'EUR', exchangeWindowDays: 30, lowStockThreshold: 3 });
    const saved = await http.put('/api/admin/shop-settings').set(a.auth).send(valid).expect(200);
    expect(saved.body).toMatchObject(valid);
    expect((await http.get('/api/admin/shop-settings').set(a.auth).expect(200)).body).toMatchObject(valid);
    const [row] = await AppDataSource.query(`SELECT exchange_window_days, low_stock_threshold, shipping_flat_cents FROM shop_settings`);
    expect(row).toEqual({ exchange_window_days: 21, low_stock_threshold: 4, shipping_flat_cents: 495 });
  });

  it('a save writes one audit row whose before and after have the same fields and differ only in what changed', async () => {
    const { http, admin: a } = await admin();
    const old = (await http.get('/api/admin/shop-settings').set(a.auth).expect(200)).body;
    await http.put('/api/admin/shop-settings').set(a.auth).send({ ...valid, shopName: old.shopName, shopAddress: old.shopAddress }).expect(200);
    const rows = (await AppDataSource.query(`SELECT actor_id, entity_type, entity_id, action, before, after FROM audit_log`)) as {
      actor_id: string; entity_type: string; entity_id: string; action: string; before: Record<string, unknown>; after: Record<string, unknown>;
    }[];
    expect(rows).toHaveLength(1);
    const r = rows[0]!;
    expect(r).toMatchObject({ actor_id: a.user.id, entity_type: 'shop-settings', entity_id: shopSettingsAuditId, action: 'update' });
    expect(Object.keys(r.before).sort()).toEqual(Object.keys(r.after).sort());
    const changed = Object.keys(r.after).filter((k) => JSON.stringify(r.before[k]) !== JSON.stringify(r.after[k])).sort();
    expect(changed).toEqual(['exchangeWindowDays', 'freeShippingThresholdCents', 'lowStockThreshold', 'reservationMinutes', 'shippingFlatCents', 'vatRateBasisPoints']);
    expect(r.after.vatRateBasisPoints).toBe(1900);
    // Saving the same figures again changes nothing and records nothing.
    await http.put('/api/admin/shop-settings').set(a.auth).send({ ...valid, shopName: old.shopName, shopAddress: old.shopAddress }).expect(200);
    expect(await AppDataSource.query(`SELECT count(*)::int AS n FROM audit_log`)).toEqual([{ n: 1 }]);
  });

  it('a failed audit write leaves the settings as they were (one transaction)', async () => {
    const { http, admin: a } = await admin();
    const old = (await http.get('/api/admin/shop-settings').set(a.auth).expect(200)).body;
    // A trigger that refuses audit rows stands in for the audit write failing after the settings row was written.
    await AppDataSource.query(`CREATE FUNCTION refuse_audit() RETURNS trigger LANGUAGE plpgsql AS $$ BEGIN RAISE EXCEPTION 'audit refused'; END $$`);
    await AppDataSource.query(`CREATE TRIGGER refuse_audit BEFORE INSERT ON audit_log FOR EACH ROW EXECUTE FUNCTION refuse_audit()`);
    try {
      expect((await http.put('/api/admin/shop-settings').set(a.auth).send(valid)).status).toBe(500);
    } finally {
      await AppDataSource.query(`DROP TRIGGER refuse_audit ON audit_log`);
      await AppDataSource.query(`DROP FUNCTION refuse_audit()`);
    }
    const [row] = await AppDataSource.query(`SELECT shop_name, vat_rate_bp FROM shop_settings`);
    expect(row).toEqual({ shop_name: old.shopName, vat_rate_bp: old.vatRateBasisPoints });
  });

  it.each([
    ['a VAT rate above the range', { vatRateBasisPoints: shopSettingRanges.vatRateBasisPoints.max + 1 }, 'vatRateBasisPoints'],
    ['a negative shipping rate', { shippingFlatCents: -1 }, 'shippingFlatCents'],
    ['a shipping rate in fractions of a cent', { shippingFlatCents: 4.5 }, 'shippingFlatCents'],
    ['a threshold given as text', { freeShippingThresholdCents: '120.00' }, 'freeShippingThresholdCents'],
    ['no reservation minutes at all (zero)', { reservationMinutes: 0 }, 'reservationMinutes'],
    ['an exchange window of more than a year', { exchangeWindowDays: 366 }, 'exchangeWindowDays'],
    ['a negative low-stock threshold', { lowStockThreshold: -2 }, 'lowStockThreshold'],
    ['a blank shop name', { shopName: '   ' }, 'shopName'],
    ['a one-letter address', { shopAddress: 'x' }, 'shopAddress'],
    ['a currency the prices are not in', { currency: 'USD' }, 'currency'],
    ['a field the settings do not have', { colour: 'red' }, 'colour'],
  ])('%s is a 400 naming that field, and nothing is saved', async (_what, patch, field) => {
    const { http, admin: a } = await admin();
    const res = await http.put('/api/admin/shop-settings').set(a.auth).send({ ...valid, ...patch });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('validation');
    expect(Object.keys(res.body.fields)).toEqual([field]);
    expect(await AppDataSource.query(`SELECT count(*)::int AS n FROM audit_log`)).toEqual([{ n: 0 }]);
  });

  it('several wrong fields are all named in one answer; a missing field is named too', async () => {
    const { http, admin: a } = await admin();
    const { lowStockThreshold: _dropped, ...missing } = valid;
    const res = await http.put('/api/admin/shop-settings').set(a.auth).send({ ...missing, vatRateBasisPoints: -5, exchangeWindowDays: 'soon' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields).sort()).toEqual(['exchangeWindowDays', 'lowStockThreshold', 'vatRateBasisPoints']);
  });

  it('null reservation minutes hands the hold time back to the server setting', async () => {
    const { http, admin: a } = await admin();
    const res = await http.put('/api/admin/shop-settings').set(a.auth).send({ ...valid, reservationMinutes: null }).expect(200);
    expect(res.body.reservationMinutes).toBeNull();
  });

  it('staff, warehouse and riders may not read or change the settings', async () => {
    const { http, config } = testApp();
    for (const role of ['rider', 'staff', 'warehouse'] as const) {
      const u = await userWithToken(config, role);
      expect((await http.get('/api/admin/shop-settings').set(u.auth)).status, role).toBe(403);
      expect((await http.put('/api/admin/shop-settings').set(u.auth).send(valid)).status, role).toBe(403);
    }
    expect((await http.get('/api/admin/shop-settings')).status).toBe(401);
  });

  it('the public shop identity and the password-reset mail carry the saved name and address', async () => {
    const { http, admin: a } = await admin();
    await http.put('/api/admin/shop-settings').set(a.auth).send(valid).expect(200);
    expect((await http.get('/api/shop').expect(200)).body).toEqual({ shopName: valid.shopName, shopAddress: valid.shopAddress });
    await createUser({ email: 'forgetful@example.test' });
    await requestPasswordReset('forgetful@example.test');
    const [mail] = (await AppDataSource.query(`SELECT text_body, html_body FROM mail_outbox`)) as { text_body: string; html_body: string }[];
    for (const part of [mail!.text_body, mail!.html_body]) {
      expect(part).toContain(valid.shopName);
      expect(part).toContain('3 Rebound Yard');
    }
  });
});
