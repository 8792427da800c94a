import bcrypt from 'bcryptjs';
import type { EntityManager } from 'typeorm';
import { User } from '../server/accounts/User.entity';
import type { Role } from '../shared/roles';
import accounts from './data/accounts.json' with { type: 'json' };

/** Writes the invented demo scenario; the caller gives the transaction. */
export async function seedDemo(em: EntityManager): Promise<void> {
  const hash = await bcrypt.hash(accounts.password, 10);
  for (const a of accounts.accounts) {
    await em.getRepository(User).save({ email: a.email, displayName: a.displayName, role: a.role as Role, passwordHash: hash });
  }
}
