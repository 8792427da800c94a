import bcrypt from 'bcryptjs';
import { plainToInstance } from 'class-transformer';
import { validateSync } from 'class-validator';
import type { EntityManager } from 'typeorm';
import { fitmentProblems, FitmentInputDto, ProductInputDto } from '../shared/catalogue';
import { flattenValidationErrors } from '../shared/dto/validation';
import { User } from '../server/accounts/User.entity';
import { AdapterNeed } from '../server/catalogue/AdapterNeed.entity';
import { applyProductInput } from '../server/catalogue/catalogue.service';
import { Product } from '../server/catalogue/Product.entity';
import { countStockTo } from '../server/stock/stock-ledger';
import { Fitment } from '../server/fitment/Fitment.entity';
import { applyFitmentInput, findOrCreateBike } from '../server/fitment/fitment.service';
import { ShopSettings } from '../server/shop/ShopSettings.entity';
import { demoShopSettings } from '../server/shop/shop-settings.service';
import type { Role } from '../shared/roles';
import accounts from './data/accounts.json' with { type: 'json' };
import fitments from './data/fitments.json' with { type: 'json' };
import products from './data/products.json' with { type: 'json' };

// The demo catalogue goes through the same validation as the staff forms, so a bad data file fails loudly.
function valid<T extends object>(cls: new () => T, plain: unknown, what: string, extra?: (dto: T) => Record<string, string>): T {
  const dto = plainToInstance(cls, plain);
  const errors = validateSync(dto, { whitelist: true, forbidNonWhitelisted: true });
  const problems = errors.length ? flattenValidationErrors(errors) : (extra?.(dto) ?? {});
  if (Object.keys(problems).length) throw new Error(`Demo data ${what} is invalid: ${JSON.stringify(problems)}`);
  return dto;
}

/**
 * Writes the invented demo scenario; the caller gives the transaction.
 * Makes, models, shop and people are invented; bike figures are typical of their class, from memory
 * (see seeds/tools/design-catalogue.ts, which chose the spring ladders with the engine).
 */
export async function seedDemo(em: EntityManager): Promise<void> {
  await seedAccounts(em);
  await seedCatalogue(em);
  await seedShopSettings(em);
}

/** The demo shop's name, address, VAT, shipping and reservation figures (invented). */
export async function seedShopSettings(em: EntityManager): Promise<void> {
  await em.getRepository(ShopSettings).upsert({ id: 1, ...demoShopSettings }, ['id']);
}

/** The four demo sign-ins, one per role. */
export async function seedAccounts(em: EntityManager): Promise<void> {
  const hash = await bcrypt.hash(accounts.password, 10);
  for (const a of accounts.accounts) {
    await em.getRepository(User).save({ email: a.email, displayName: a.displayName, role: a.role as Role, passwordHash: hash });
  }
}

export async function seedCatalogue(em: EntityManager): Promise<void> {
  const fitmentIds = new Map<string, string>();
  for (const plain of fitments) {
    const dto = valid(FitmentInputDto, plain, `fitment ${plain.make} ${plain.model}`, fitmentProblems);
    const bike = await findOrCreateBike(em, dto.make, dto.model);
    const f = em.getRepository(Fitment).create();
    applyFitmentInput(f, dto, bike.id);
    const saved = await em.save(f);
    fitmentIds.set(`${dto.make}|${dto.model}|${dto.variant ?? ''}`, saved.id);
  }
  const skuIds = new Map<string, string>();
  for (const plain of [...products.springs, ...products.others]) {
    const dto = valid(ProductInputDto, plain, `product ${plain.sku}`);
    const p = em.getRepository(Product).create();
    applyProductInput(p, dto);
    const id = (await em.save(p)).id;
    // The opening count is the first row of the product's stock ledger, as for a product added by staff.
    await countStockTo(em, id, dto.stockOnHand, { actorId: null, note: 'opening count' });
    skuIds.set(dto.sku, id);
  }
  for (const need of products.adapterNeeds) {
    const fitmentId = fitmentIds.get(`${need.fitment.make}|${need.fitment.model}|${need.fitment.variant}`);
    const adapterId = skuIds.get(need.adapterSku);
    if (!fitmentId || !adapterId) throw new Error(`Demo adapter need refers to something missing: ${JSON.stringify(need)}`);
    for (const [sku, springId] of skuIds) {
      if (!sku.startsWith(`LL-${need.springFamily}-`)) continue;
      await em.getRepository(AdapterNeed).insert({ fitmentId, springId, adapterId, quantity: need.quantity });
    }
  }
}
