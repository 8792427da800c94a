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

// Read on every checkout and cart view; the row changes rarely, so each server keeps it for a few seconds.
const cacheMs = 5_000;
let cached: { at: number; value: ShopSettings } | undefined;

/** Forgets the kept copy (the settings page calls it after a save; tests after writing the row). */
export function shopSettingsChanged(): void {
  cached = undefined;
}

/** The one row of shop settings; written from the demo figures the first time anything asks. Inside a transaction it is read fresh. */
export async function getShopSettings(em?: EntityManager): Promise<ShopSettings> {
  if (em) return readShopSettings(em);
  if (cached && Date.now() - cached.at < cacheMs) return cached.value;
  const value = await readShopSettings(AppDataSource.manager);
  cached = { at: Date.now(), value };
  return value;
}

async function readShopSettings(em: EntityManager): Promise<ShopSettings> {
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
