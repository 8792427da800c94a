import type { ShopIdentityDto, ShopSettingsDto } from '../../shared/admin/shop-settings';
import type { ShopSettingsInputDto } from '../../shared/admin/shop-settings.dto';
import { recordAudit } from '../audit/audit.service';
import { AppDataSource } from '../db/data-source';
import { ShopSettings } from './ShopSettings.entity';
import { getShopSettings, shopSettingsChanged } from './shop-settings.service';

/** The audit log keys rows by uuid; the single settings row is always this one. */
export const shopSettingsAuditId = '00000000-0000-4000-8000-000000000001';

/** One shape for the page, the reply and both sides of the audit row, so the audit shows only what changed. */
export function toShopSettingsDto(s: ShopSettings): ShopSettingsDto {
  return {
    shopName: s.shopName,
    shopAddress: s.shopAddress,
    currency: s.currency,
    vatRateBasisPoints: s.vatRateBasisPoints,
    shippingFlatCents: s.shippingFlatCents,
    freeShippingThresholdCents: s.freeShippingThresholdCents,
    reservationMinutes: s.reservationMinutes,
    exchangeWindowDays: s.exchangeWindowDays,
    lowStockThreshold: s.lowStockThreshold,
    updatedAt: s.updatedAt.toISOString(),
  };
}

export async function readShopSettingsForAdmin(): Promise<ShopSettingsDto> {
  return toShopSettingsDto(await AppDataSource.transaction((em) => getShopSettings(em)));
}

export async function shopIdentity(): Promise<ShopIdentityDto> {
  const s = await getShopSettings();
  return { shopName: s.shopName, shopAddress: s.shopAddress };
}

// The save time is the audit row's own "at"; leaving it out keeps before and after comparable field by field.
const forAudit = ({ updatedAt: _u, ...rest }: ShopSettingsDto): Omit<ShopSettingsDto, 'updatedAt'> => rest;

/**
 * Saves every setting and its audit row in one transaction; the row is locked so two admins saving at once are
 * recorded one after the other, each audit row's "before" being what the other left.
 */
export async function updateShopSettings(actorId: string, input: ShopSettingsInputDto): Promise<ShopSettingsDto> {
  const saved = await AppDataSource.transaction(async (em) => {
    await getShopSettings(em);
    const repo = em.getRepository(ShopSettings);
    const current = await repo.findOneOrFail({ where: { id: 1 }, lock: { mode: 'pessimistic_write' } });
    const before = toShopSettingsDto(current);
    Object.assign(current, {
      ...input,
      shopName: input.shopName.trim(),
      shopAddress: input.shopAddress.trim(),
    });
    const after = toShopSettingsDto(await repo.save(current));
    const [b, a] = [forAudit(before), forAudit(after)];
    if (JSON.stringify(b) !== JSON.stringify(a)) {
      await recordAudit(em, { actorId, entityType: 'shop-settings', entityId: shopSettingsAuditId, action: 'update', before: b, after: a });
    }
    return after;
  });
  // This server reads the new figures at once; others within the settings cache window (a few seconds).
  shopSettingsChanged();
  return saved;
}
