// The API tests' own database: never the demo's, so a test run leaves the demo data alone.
export const testDatabaseUrl = process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54339/loadline_test';

export function assertTestDatabase(url: string): void {
  const name = new URL(url).pathname.slice(1);
  if (!name.endsWith('_test')) throw new Error(`Refusing to run API tests against '${name}': the database name must end in _test.`);
}
