import { AppDataSource } from '../server/db/data-source';
import { User } from '../server/accounts/User.entity';
import { seedDemo } from './demo';

// --if-empty seeds only a fresh database, so npm start never overwrites what someone changed in the demo.
const ifEmpty = process.argv.includes('--if-empty');
const ds = await AppDataSource.initialize();
try {
  const count = await ds.getRepository(User).count();
  if (ifEmpty && count > 0) {
    console.log('loadline: demo data already present, not seeding');
  } else {
    await ds.transaction((em) => seedDemo(em));
    console.log('loadline: demo data seeded');
  }
} finally {
  await ds.destroy();
}
