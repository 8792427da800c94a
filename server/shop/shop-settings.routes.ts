import { Router } from 'express';
import { ShopSettingsInputDto } from '../../shared/admin/shop-settings.dto';
import { requireRole, requireUser } from '../http/auth';
import { parseBody } from '../http/validate';
import { readShopSettingsForAdmin, shopIdentity, updateShopSettings } from './shop-settings-admin.service';

/** The shop's settings, read and saved by admins; every save is audited. */
export function adminShopSettingsRoutes(): Router {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', async (_req, res) => {
    res.json(await readShopSettingsForAdmin());
  });
  r.put('/', async (req, res) => {
    const dto = await parseBody(ShopSettingsInputDto, req.body);
    res.json(await updateShopSettings(requireUser(req).id, dto));
  });
  return r;
}

/** The shop's name and address for anyone (the printed setup sheet signs with them). */
export function shopIdentityRoutes(): Router {
  const r = Router();
  r.get('/', async (_req, res) => {
    res.json(await shopIdentity());
  });
  return r;
}
