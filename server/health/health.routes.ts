import { Router } from 'express';
import { AppDataSource } from '../db/data-source';
import { endpoint } from '../http/endpoint';

/** Asks the database a trivial question with a short deadline. */
export async function databaseIsUp(): Promise<boolean> {
  if (!AppDataSource.isInitialized) return false;
  try {
    await Promise.race([
      AppDataSource.query('SELECT 1'),
      new Promise((_, reject) => setTimeout(() => reject(new Error('health check timed out')), 2000).unref()),
    ]);
    return true;
  } catch {
    return false;
  }
}

export function healthRoutes(): Router {
  const r = Router();
  r.get('/', endpoint({ summary: 'Whether the server and its database answer (503 when the database does not)' }, async (_input, _req, res) => {
    const up = await databaseIsUp();
    res.status(up ? 200 : 503).json(up ? { status: 'ok', db: 'ok' } : { status: 'degraded', db: 'down' });
  }));
  return r;
}
