import bcrypt from 'bcryptjs';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../app';
import { parseConfig, type Config } from '../config';
import { signToken } from '../accounts/tokens';
import { User } from '../accounts/User.entity';
import { AppDataSource } from '../db/data-source';
import type { Role } from '../../shared/roles';

export const testPassword = 'correct-horse-battery';
// Hashing once keeps factories fast; cost 4 is fine for throwaway test accounts.
const testHash = bcrypt.hashSync(testPassword, 4);

export function testConfig(overrides: Partial<Config> = {}): Config {
  return { ...parseConfig({ ...process.env, JWT_SECRET: 'test-secret-test-secret-test-secret-0123' }), ...overrides };
}

export function testApp(overrides: Partial<Config> = {}): { app: Express; config: Config; http: ReturnType<typeof request> } {
  const config = testConfig(overrides);
  const app = createApp(config);
  return { app, config, http: request(app) };
}

/** A saved user with valid defaults; a test overrides what it cares about. */
export async function createUser(overrides: Partial<User> = {}): Promise<User> {
  return AppDataSource.getRepository(User).save({
    email: `user-${randomUUID().slice(0, 8)}@example.test`,
    displayName: 'Test Rider',
    role: 'rider' as Role,
    passwordHash: testHash,
    ...overrides,
  });
}

export async function userWithToken(config: Config, role: Role = 'rider', overrides: Partial<User> = {}) {
  const user = await createUser({ role, ...overrides });
  const { token } = signToken(config, { sub: user.id, role: user.role, tv: user.tokenVersion });
  return { user, token, auth: { Authorization: `Bearer ${token}` } };
}
