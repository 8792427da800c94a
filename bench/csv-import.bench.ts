import { performance } from 'node:perf_hooks';
import { freshDemoDatabase } from './lib';

/** Imports 5,000 new fitments in one transaction through the service the staff route uses, then re-imports them unchanged; prints rows/s. */
export async function run(): Promise<void> {
  await freshDemoDatabase();
  const { AppDataSource } = await import('../server/db/data-source');
  const { exportFitmentsCsv, importFitmentsCsv } = await import('../server/fitment/fitment-csv');
  const { parse } = await import('csv-parse/sync');
  const { stringify } = await import('csv-stringify/sync');
  const [{ id: actorId }] = (await AppDataSource.query(`SELECT id FROM users WHERE role = 'staff' LIMIT 1`)) as [{ id: string }];

  const template = (parse(await exportFitmentsCsv(), { columns: true }) as Record<string, string>[]);
  const rows = Array.from({ length: 5000 }, (_, i) => {
    const t = template[i % template.length]!;
    return { ...t, id: '', model: `${t.model} B${Math.floor(i / template.length)}`, yearFrom: t.yearFrom };
  });
  const csv = stringify(rows, { header: true, columns: Object.keys(template[0]!) });
  console.log(`\ncsv-import: ${rows.length} rows, ${(csv.length / 1024 / 1024).toFixed(1)} MiB`);

  const time = async (label: string, fn: () => Promise<{ created: number; updated: number; unchanged: number }>) => {
    const t0 = performance.now();
    const r = await fn();
    const s = (performance.now() - t0) / 1000;
    console.log(`  ${label.padEnd(32)} ${s.toFixed(2)} s   ${(rows.length / s).toFixed(0)} rows/s   (created ${r.created}, updated ${r.updated}, unchanged ${r.unchanged})`);
  };
  await time('preview (dry run)', () => importFitmentsCsv(actorId, csv, { dryRun: true }));
  await time('import, one transaction', () => importFitmentsCsv(actorId, csv, { dryRun: false }));
  const exported = await exportFitmentsCsv();
  await time('re-import of the export (5,020)', () => importFitmentsCsv(actorId, exported, { dryRun: false }));
  const [{ n }] = (await AppDataSource.query('SELECT count(*)::int AS n FROM fitments')) as [{ n: number }];
  console.log(`  fitments in the table: ${n}`);
}
