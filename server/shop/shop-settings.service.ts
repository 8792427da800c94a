import type { EntityManager } from 'typeorm';
import type { PricingSettings } from '../../shared/cart-totals';
import type { ShopPublicDto } from '../../shared/commerce/cart.dto';
import type { Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { ShopSettings } from './ShopSettings.entity';

/** The demo shop's own figures (invented); the seed writes them and a missing row falls back to them. */
export const demoShopSettings: Omit<ShopSettings, 'id' | 'updatedAt'> = {
  shopName: 'Loadline Spring Works',
  shopAddress: 'Unit 7, Coilyard Park, 14 Damper Row, 10999 Eastbrook',
  currency: 'EUR',
  vatRateBasisPoints: 2000,
  shippingFlatCents: 690,
  freeShippingThresholdCents: 15_000,
  reservationMinutes: null,
};

/** The one row of shop settings; written from the demo figures the first time anything asks. */
export async function getShopSettings(em: EntityManager = AppDataSource.manager): Promise<ShopSettings> {
  const repo = em.getRepository(ShopSettings);
  const found = await repo.findOneBy({ id: 1 });
  if (found) return found;
  await repo.createQueryBuilder().insert().values({ id: 1, ...demoShopSettings }).orIgnore().execute();
  return repo.findOneByOrFail({ id: 1 });
}

export const pricingOf = (s: ShopSettings): PricingSettings => ({
  currency: s.currency,
  vatRateBasisPoints: s.vatRateBasisPoints,
  shippingFlatCents: s.shippingFlatCents,
  freeShippingThresholdCents: s.freeShippingThresholdCents,
});

export const reservationMinutesOf = (s: ShopSettings, config: Config) => s.reservationMinutes ?? config.reservationMinutes;

export function toShopPublicDto(s: ShopSettings, config: Config): ShopPublicDto {
  return { ...pricingOf(s), shopName: s.shopName, shopAddress: s.shopAddress, reservationMinutes: reservationMinutesOf(s, config) };
}
