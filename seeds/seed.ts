import { AppDataSource } from '../server/db/data-source';
import { User } from '../server/accounts/User.entity';
import { Fitment } from '../server/fitment/Fitment.entity';
import { Product } from '../server/catalogue/Product.entity';
import { seedAccounts, seedCatalogue, seedShopSettings } from './demo';
import { ShopSettings } from '../server/shop/ShopSettings.entity';
import { Order } from '../server/orders/Order.entity';
import { getConfig } from '../server/config';
import { seedDemoOrders } from './demo-orders';

// --if-empty seeds only the parts that are empty, so npm start never overwrites what someone changed in the demo,
// yet a demo database from before the catalogue existed still gets one.
const ifEmpty = process.argv.includes('--if-empty');
const ds = await AppDataSource.initialize();
try {
  await ds.transaction(async (em) => {
    const seeded: string[] = [];
    if (!ifEmpty || (await em.getRepository(User).count()) === 0) {
      await seedAccounts(em);
      seeded.push('accounts');
    }
    if (!ifEmpty || ((await em.getRepository(Fitment).count()) === 0 && (await em.getRepository(Product).count()) === 0)) {
      await seedCatalogue(em);
      seeded.push('catalogue');
    }
    if (!ifEmpty || (await em.getRepository(ShopSettings).count()) === 0) {
      await seedShopSettings(em);
      seeded.push('shop settings');
    }
    console.log(seeded.length ? `loadline: demo ${seeded.join(' and ')} seeded` : 'loadline: demo data already present, not seeding');
  });
  // Orders go through the checkout and payment services, each in transactions of their own, after the catalogue is in.
  if ((await ds.getRepository(Order).count()) === 0) console.log(`loadline: ${await seedDemoOrders(getConfig())} paid demo orders seeded`);
} finally {
  await ds.destroy();
}
