import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { getConfig } from '../config';
import { entities } from './entities';
import { migrations } from './migrations/index';

export const AppDataSource = new DataSource({
  type: 'postgres',
  url: getConfig().databaseUrl,
  entities,
  migrations,
  synchronize: false,
  migrationsRun: false,
  logging: false,
  // Fail fast while the database is away so /api/health can say so instead of hanging.
  extra: { connectionTimeoutMillis: 2000, max: 20, idleTimeoutMillis: 10000 },
});
