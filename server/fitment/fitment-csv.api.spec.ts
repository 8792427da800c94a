import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { describe, expect, it } from 'vitest';
import type { CsvImportReportDto } from '../../shared/catalogue';
import { seedDemo } from '../../seeds/demo';
import { AppDataSource } from '../db/data-source';
import { fitmentInput } from '../test/catalogue-factories';
import { testApp, userWithToken } from '../test/factories';

async function staffApp() {
  const t = testApp();
  const staff = await userWithToken(t.config, 'staff');
  const exportCsv = async () => (await t.http.get('/api/staff/fitments/export.csv').set(staff.auth).expect(200)).text;
  const send = (path: string, csv: string) => t.http.post(`/api/staff/fitments/${path}`).set(staff.auth).set('Content-Type', 'text/csv').send(csv);
  return { ...t, staff, exportCsv, send };
}

const rowsOf = (csv: string) => parse(csv, { columns: true }) as Record<string, string>[];
const csvOf = (rows: Record<string, string>[]) => stringify(rows, { header: true, columns: Object.keys(rows[0]!) });

describe('the fitment table as CSV', () => {
  it('an exported file re-imports unchanged, and exports again byte for byte', async () => {
    await AppDataSource.transaction((em) => seedDemo(em));
    const { exportCsv, send } = await staffApp();
    const first = await exportCsv();
    expect(rowsOf(first)).toHaveLength(20);
    const preview = await send('import/preview', first);
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual({ dryRun: true, rows: 20, created: 0, updated: 0, unchanged: 20, problems: [], warnings: [] } satisfies CsvImportReportDto);
    const imported = await send('import', first);
    expect(imported.body).toMatchObject({ dryRun: false, unchanged: 20, created: 0, updated: 0 });
    expect(await exportCsv()).toBe(first);
  });

  it('rows without an id are created, a changed row is updated, and both are audited as imports', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const rows = rowsOf(await exportCsv());
    const changed = { ...rows[0]!, rearLeverage: '0:2.8; 100:2.6; 200:2.4', notes: 'curve, "quoted", with, commas\nand a new line' };
    const added = { ...rows[0]!, id: '', model: 'Ridgeline 900', massInput: 'wet', frontSprungMassKg: '', rearSprungMassKg: '', wetMassKg: '230', frontStaticSharePct: '49', frontUnsprungMassKg: '19', rearUnsprungMassKg: '25' };
    const res = await send('import', csvOf([changed, added]));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ rows: 2, created: 1, updated: 1, unchanged: 0, problems: [] });
    const list = (await http.get('/api/fitments').query({ sort: 'model' })).body.items;
    expect(list.map((f: { model: string }) => f.model)).toEqual(['Ridgeline 800', 'Ridgeline 900']);
    const updated = (await http.get(`/api/fitments/${rows[0]!.id}`)).body;
    expect(updated.rearLeverageCurve).toEqual([{ wheelTravelMm: 0, ratio: 2.8 }, { wheelTravelMm: 100, ratio: 2.6 }, { wheelTravelMm: 200, ratio: 2.4 }]);
    expect(updated.notes).toBe('curve, "quoted", with, commas\nand a new line');
    const created = (await http.get(`/api/fitments/${list[1].id}`)).body;
    expect(created.frontSprungMassKg).toBeCloseTo(230 * 0.49 - 19, 9);
    const [{ n }] = await AppDataSource.query(`SELECT count(*)::int AS n FROM audit_log WHERE action = 'import'`);
    expect(n).toBe(2);
  });

  it('the static-sag tolerances, shock count and stock fork spacer and preload travel as columns, and a file without them takes the defaults', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    const twin = fitmentInput({ shockCount: 2, rearStaticSagToleranceMm: 5, frontStaticSagToleranceMm: 4, forkAdjusterPitchMm: null, forkStockSpacerMm: 110, forkStockPreloadMm: 12 });
    await http.post('/api/staff/fitments').set(staff.auth).send(twin).expect(201);
    const [row] = rowsOf(await exportCsv());
    expect(row).toMatchObject({ shockCount: '2', rearStaticSagToleranceMm: '5', frontStaticSagToleranceMm: '4', forkStockSpacerMm: '110', forkStockPreloadMm: '12' });
    const { shockCount: _s, rearStaticSagToleranceMm: _r, frontStaticSagToleranceMm: _f, forkStockSpacerMm: _x, forkStockPreloadMm: _p, ...older } = row!;
    const res = await send('import', csvOf([{ ...older, id: '', model: 'Older file' }]));
    expect(res.status).toBe(200);
    const list = (await http.get('/api/fitments').query({ model: 'Older file' })).body.items;
    const created = (await http.get(`/api/fitments/${list[0].id}`)).body;
    // The bottom of the fork preload range stands in for an unknown stock preload.
    expect(created).toMatchObject({ shockCount: 1, rearStaticSagToleranceMm: 3, frontStaticSagToleranceMm: 3, forkStockSpacerMm: null, forkStockPreloadMm: twin.forkPreloadMinMm });
  });

  it('the shared consistency rules judge CSV rows as the form does: a ratio past the stroke is refused, an unused stroke is only a warning', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const [row] = rowsOf(await exportCsv());
    // 200 mm ÷ 2.6 = 76.9 mm of shock travel.
    const refused = await send('import/preview', csvOf([{ ...row!, shockStrokeMm: '70' }, { ...row!, id: '', model: 'Pillion ahead', passengerPositionMm: '700' }]));
    expect(refused.body.problems.map((p: { line: number; column: string }) => [p.line, p.column])).toEqual([
      [2, 'rearLeverage'],
      [3, 'passengerPositionMm'],
    ]);
    const warned = await send('import', csvOf([{ ...row!, shockStrokeMm: '100' }]));
    expect(warned.status).toBe(200);
    expect(warned.body).toMatchObject({ updated: 1, problems: [], warnings: [{ line: 2, column: 'shockStrokeMm', message: expect.stringMatching(/76\.9 of its 100 mm stroke/) }] });
  });

  it('an imported update is audited with the same fitment shape before and after, as the form saves it', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const [row] = rowsOf(await exportCsv());
    await send('import', csvOf([{ ...row!, wheelbaseMm: '1530' }, { ...row!, id: '', model: 'Ridgeline 900' }])).expect(200);
    const entries: { before: Record<string, unknown> | null; after: Record<string, unknown> }[] = await AppDataSource.query(
      `SELECT before, after FROM audit_log WHERE action = 'import' ORDER BY (before IS NULL)`,
    );
    const [update, create] = entries;
    expect(Object.keys(update!.after).sort()).toEqual(Object.keys(update!.before!).sort());
    expect(Object.keys(create!.after).sort()).toEqual(Object.keys(update!.before!).sort());
    expect(update!.before).toMatchObject({ wheelbaseMm: 1520, make: 'Corvane' });
    expect(update!.after).toMatchObject({ wheelbaseMm: 1530, make: 'Corvane', stockShockRate: expect.any(Object) });
    expect(create!.after).toMatchObject({ model: 'Ridgeline 900' });
  });

  it('a CSV with bad rows is refused whole, with every problem listed by line and column', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const [good] = rowsOf(await exportCsv());
    const fresh = { ...good!, id: '' };
    const rows = [
      { ...fresh, model: 'Good new one' },
      { ...fresh, model: 'Bad wheelbase', wheelbaseMm: 'long' },
      { ...fresh, model: 'Bad years', yearFrom: '2024', yearTo: '2020' },
      { ...fresh, model: 'Bad sag', rearSagRoadStatic: '90' },
      { ...fresh, model: 'Bad station', tankBagMaxKg: '900' },
      { ...fresh, model: 'Bad leverage', rearLeverage: '0:2.8; 100:x' },
      { ...fresh, model: 'Bad id', id: 'row-7' },
      { ...fresh, model: 'Bad torque', torques: 'Fork cap' },
    ];
    const csv = csvOf(rows);
    const preview = await send('import/preview', csv);
    expect(preview.status).toBe(200);
    const problems = (preview.body as CsvImportReportDto).problems.map((p) => [p.line, p.column]);
    expect(problems).toEqual([
      [3, 'wheelbaseMm'],
      [4, 'yearTo'],
      [5, 'rearSagRoadStatic'],
      [6, 'tankBagMaxKg'],
      [7, 'rearLeverage'],
      [8, 'id'],
      [9, 'torques'],
    ]);
    const res = await send('import', csv);
    expect(res.status).toBe(400);
    expect(res.body.details.problems).toHaveLength(7);
    expect(res.body.message).toMatch(/7 problem/);
    expect((await http.get('/api/fitments')).body.total).toBe(1);
  });

  it('a dry run writes nothing', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const [row] = rowsOf(await exportCsv());
    const res = await send('import/preview', csvOf([{ ...row!, id: '', model: 'Preview only' }]));
    expect(res.body).toMatchObject({ dryRun: true, created: 1 });
    expect((await http.get('/api/fitments')).body.total).toBe(1);
  });

  it('duplicates within the file and against the table are problems', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const [row] = rowsOf(await exportCsv());
    const res = await send('import/preview', csvOf([row!, { ...row! }, { ...row!, id: '' }]));
    expect(res.body.problems.map((p: { line: number; column: string }) => [p.line, p.column])).toEqual([
      [3, 'id'],
      [3, 'yearFrom'],
      [4, 'yearFrom'],
    ]);
  });

  it('a cell with a NUL character is a problem on its line and column, and nothing is written', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const [row] = rowsOf(await exportCsv());
    const res = await send('import', csvOf([row!, { ...row!, id: '', variant: 'Two\u0000up' }]));
    expect(res.status).toBe(400);
    expect(res.body.details.problems).toEqual([{ line: 3, column: 'variant', message: expect.any(String) }]);
    expect((await http.get('/api/fitments')).body.total).toBe(1);
  });

  it('a fitment saved by someone else while an import runs is checked against, not a 500', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    const first = (await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201)).body;
    const [row] = rowsOf(await exportCsv());
    // Another connection adds the same make, model, variant and year as the file's new row, and commits mid-import.
    const qr = AppDataSource.createQueryRunner();
    await qr.connect();
    await qr.startTransaction();
    try {
      await qr.query(`CREATE TEMP TABLE copy ON COMMIT DROP AS SELECT * FROM fitments WHERE id = $1`, [first.id]);
      await qr.query(`UPDATE copy SET id = gen_random_uuid(), variant = 'Two-up'`);
      await qr.query(`INSERT INTO fitments SELECT * FROM copy`);
      const pending = send('import', csvOf([{ ...row!, id: '', variant: 'Two-up' }])).then((r) => r);
      await new Promise((r) => setTimeout(r, 400));
      await qr.commitTransaction();
      const res = await pending;
      expect(res.status).toBe(400);
      expect(res.body.details.problems).toMatchObject([{ line: 2, column: 'yearFrom' }]);
    } finally {
      await qr.release();
    }
    expect((await http.get('/api/fitments')).body.total).toBe(2);
  });

  it('a header with an unknown or a missing column, broken quoting, or no CSV at all is refused', async () => {
    const { exportCsv, send } = await staffApp();
    const header = (await exportCsv()).trim();
    const unknown = await send('import', `${header},colour\n`);
    expect(unknown.status).toBe(400);
    expect(unknown.body.details.problems).toEqual([{ line: 1, column: 'colour', message: 'Unknown column.' }]);
    const missing = await send('import', header.replace(',notes', '') + '\n');
    expect(missing.body.details.problems).toEqual([{ line: 1, column: 'notes', message: 'This column is missing.' }]);
    const broken = await send('import', `${header}\n"unterminated,`);
    expect(broken.status).toBe(400);
    expect(broken.body.details.problems[0].message).toMatch(/not valid CSV/);
    expect((await send('import', '')).status).toBe(400);
  });

  it('a CSV of 5,000 fitments imports in one transaction, and one bad row among them stops them all', async () => {
    const { http, staff, exportCsv, send } = await staffApp();
    await http.post('/api/staff/fitments').set(staff.auth).send(fitmentInput()).expect(201);
    const [row] = rowsOf(await exportCsv());
    await http.delete(`/api/staff/fitments/${row!.id}`).set(staff.auth).expect(204);
    const rows = Array.from({ length: 5000 }, (_, i) => ({ ...row!, id: '', model: `Ridgeline ${i}` }));
    const bad = await send('import', csvOf([...rows.slice(0, 4999), { ...rows[4999]!, forkTravelMm: '-5' }]));
    expect(bad.status).toBe(400);
    expect(bad.body.details.problems).toEqual([{ line: 5001, column: 'forkTravelMm', message: expect.any(String) }]);
    expect((await http.get('/api/fitments')).body.total).toBe(0);
    const good = await send('import', csvOf(rows));
    expect(good.status).toBe(200);
    expect(good.body.created).toBe(5000);
    // Every row written by one transaction carries that transaction's id in xmin.
    const [{ n, tx }] = await AppDataSource.query(`SELECT count(*)::int AS n, count(DISTINCT xmin::text)::int AS tx FROM fitments`);
    expect({ n, tx }).toEqual({ n: 5000, tx: 1 });
    const [{ same }] = await AppDataSource.query(`SELECT bool_and(a.xmin::text = f.xmin::text) AS same FROM audit_log a JOIN fitments f ON f.id = a.entity_id WHERE a.action = 'import'`);
    expect(same).toBe(true);
  }, 60_000);
});
