import { Router } from 'express';
import { ShopSettingsInputDto } from '../../shared/admin/shop-settings.dto';
import { requireRole, requireUser } from '../http/auth';
import { endpoint } from '../http/endpoint';
import { readShopSettingsForAdmin, shopIdentity, updateShopSettings } from './shop-settings-admin.service';

/** The shop's settings, read and saved by admins; every save is audited. */
export function adminShopSettingsRoutes(): Router {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', endpoint({ summary: 'The shop’s settings' }, async (_input, _req, res) => {
    res.json(await readShopSettingsForAdmin());
  }));
  r.put('/', endpoint({ summary: 'Save the shop’s settings (audited)', body: ShopSettingsInputDto }, async ({ body }, req, res) => {
    res.json(await updateShopSettings(requireUser(req).id, body));
  }));
  return r;
}

/** The shop's name and address for anyone (the printed setup sheet signs with them). */
export function shopIdentityRoutes(): Router {
  const r = Router();
  r.get('/', endpoint({ summary: 'The shop’s name and address' }, async (_input, _req, res) => {
    res.json(await shopIdentity());
  }));
  return r;
}
