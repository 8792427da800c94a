import { plainToInstance } from 'class-transformer';
import { validateSync } from 'class-validator';
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import { randomUUID } from 'node:crypto';
import { In, type EntityManager } from 'typeorm';
import {
  fitmentProblems,
  fitmentWarnings,
  FitmentInputDto,
  loadStationKinds,
  type CsvImportReportDto,
  type CsvProblemDto,
  type FitmentDto,
  type LoadStationKind,
} from '../../shared/catalogue';
import { flattenValidationErrors, isStorableText, unstorableTextMessage } from '../../shared/dto/validation';
import { recordAudit } from '../audit/audit.service';
import { catalogueChanged } from '../catalogue/catalogue-cache';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { Bike } from './Bike.entity';
import { Fitment } from './Fitment.entity';
import { applyFitmentInput, toFitmentDto, type FitmentWithBike } from './fitment.service';

const stationPrefix: Record<LoadStationKind, string> = {
  rider: 'rider',
  passenger: 'passenger',
  'tank-bag': 'tankBag',
  panniers: 'panniers',
  'top-case': 'topCase',
};
const styles = [
  ['road', 'Road'],
  ['adventure', 'Adventure'],
  ['offRoad', 'OffRoad'],
] as const;
const ends = ['front', 'rear'] as const;

// Plain numeric columns: the CSV column has the same name as the input field.
const numberColumns = [
  'yearFrom', 'yearTo', 'frontSprungMassKg', 'rearSprungMassKg', 'wetMassKg', 'frontStaticSharePct', 'frontUnsprungMassKg',
  'rearUnsprungMassKg', 'ratedLoadKg', 'wheelbaseMm', 'rearWheelTravelMm', 'shockStrokeMm', 'rearPreloadMinMm', 'rearPreloadMaxMm',
  'rearAdjusterPitchMm', 'shockSpringInnerDiameterMm', 'shockSpringFreeLengthMinMm', 'shockSpringFreeLengthMaxMm', 'forkAngleDeg',
  'forkTravelMm', 'forkSpringCount', 'forkPreloadMinMm', 'forkPreloadMaxMm', 'forkAdjusterPitchMm', 'forkSpringInnerDiameterMm',
  'forkSpringFreeLengthMinMm', 'forkSpringFreeLengthMaxMm', 'stockForkRateNPerMm', 'stockForkFreeLengthMm', 'stockShockRateNPerMm',
  'stockShockFreeLengthMm', 'shockCount', 'forkStockSpacerMm', 'forkStockPreloadMm', 'frontStaticSagToleranceMm',
  'rearStaticSagToleranceMm',
] as const;

/** Columns added after the first files were written; a file without them imports with their defaults. */
const optionalColumns: readonly string[] = ['shockCount', 'forkStockSpacerMm', 'forkStockPreloadMm', 'frontStaticSagToleranceMm', 'rearStaticSagToleranceMm'];

/** Every column, in the order the export writes them; docs/catalogue-api.md describes each. */
export const csvColumns: string[] = [
  'id', 'make', 'model', 'variant', 'yearFrom', 'yearTo', 'massInput',
  'frontSprungMassKg', 'rearSprungMassKg', 'wetMassKg', 'frontStaticSharePct', 'frontUnsprungMassKg', 'rearUnsprungMassKg',
  'ratedLoadKg', 'wheelbaseMm',
  ...loadStationKinds.flatMap((s) => [`${stationPrefix[s]}PositionMm`, `${stationPrefix[s]}MaxKg`]),
  'rearLeverage', 'rearWheelTravelMm', 'shockStrokeMm', 'shockCount', 'rearPreloadMinMm', 'rearPreloadMaxMm', 'rearAdjusterPitchMm',
  'shockSpringInnerDiameterMm', 'shockSpringFreeLengthMinMm', 'shockSpringFreeLengthMaxMm',
  'forkAngleDeg', 'forkTravelMm', 'forkSpringCount', 'forkPreloadMinMm', 'forkPreloadMaxMm', 'forkAdjusterPitchMm',
  'forkStockSpacerMm', 'forkStockPreloadMm', 'forkSpringInnerDiameterMm', 'forkSpringFreeLengthMinMm', 'forkSpringFreeLengthMaxMm',
  ...ends.flatMap((e) => [`${e}SagUnit`, ...styles.flatMap(([, S]) => [`${e}Sag${S}Static`, `${e}Sag${S}Rider`])]),
  'frontStaticSagToleranceMm', 'rearStaticSagToleranceMm',
  'stockForkRateNPerMm', 'stockForkFreeLengthMm', 'stockShockRateNPerMm', 'stockShockFreeLengthMm',
  'torques', 'tools', 'notes',
];

// String(n) is the shortest text that parses back to the same double, so numbers round-trip exactly.
const cell = (v: number | string | null | undefined): string => (v === null || v === undefined ? '' : String(v));

function toRow(f: FitmentDto): Record<string, string> {
  const row: Record<string, string> = {
    id: f.id,
    make: f.make,
    model: f.model,
    variant: f.variant,
    massInput: f.massInput,
    rearLeverage: f.rearLeverageCurve ? f.rearLeverageCurve.map((p) => `${p.wheelTravelMm}:${p.ratio}`).join('; ') : cell(f.rearLeverageRatio),
    torques: f.torques.map((t) => `${t.fastener}=${t.torqueNm}`).join(' | '),
    tools: f.tools.join(' | '),
    notes: f.notes,
  };
  for (const c of numberColumns) row[c] = cell(f[c]);
  // A sprung-mass row keeps only what was entered, so it re-imports as the same input.
  if (f.massInput === 'wet') {
    row.frontSprungMassKg = '';
    row.rearSprungMassKg = '';
  }
  for (const s of loadStationKinds) {
    const st = f.loadStations.find((x) => x.station === s);
    row[`${stationPrefix[s]}PositionMm`] = cell(st?.positionMm);
    row[`${stationPrefix[s]}MaxKg`] = cell(st?.maxLoadKg);
  }
  for (const e of ends) {
    row[`${e}SagUnit`] = f.sag[e].unit;
    for (const [k, S] of styles) {
      row[`${e}Sag${S}Static`] = cell(f.sag[e][k].static);
      row[`${e}Sag${S}Rider`] = cell(f.sag[e][k].rider);
    }
  }
  return row;
}

async function allFitments(em: EntityManager = AppDataSource.manager): Promise<FitmentWithBike[]> {
  return (await em
    .getRepository(Fitment)
    .createQueryBuilder('f')
    .innerJoinAndSelect('f.bike', 'b')
    .orderBy('b.make')
    .addOrderBy('b.model')
    .addOrderBy('f.variant')
    .addOrderBy('f.yearFrom')
    .addOrderBy('f.id')
    .getMany()) as FitmentWithBike[];
}

/** The whole fitment table as CSV, one row per fitment. */
export async function exportFitmentsCsv(): Promise<string> {
  const rows = (await allFitments()).map((f) => toRow(toFitmentDto(f)));
  return stringify(rows, { header: true, columns: csvColumns });
}

interface ParsedRow {
  line: number;
  id: string | null;
  dto: FitmentInputDto;
}

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Maps an input field path from the validator to the CSV column that holds it. */
function columnOf(path: string, stations: LoadStationKind[]): string {
  const parts = path.split('.');
  const [head, second, third, fourth] = parts;
  if (head === 'loadStations') {
    const st = second !== undefined ? stations[Number(second)] : undefined;
    if (!st) return `${stationPrefix.rider}PositionMm`;
    return third === 'maxLoadKg' ? `${stationPrefix[st]}MaxKg` : `${stationPrefix[st]}PositionMm`;
  }
  if (head === 'rearLeverageRatio' || head === 'rearLeverageCurve') return 'rearLeverage';
  if (head === 'torques' || head === 'tools') return head;
  if (head === 'sag' && second) {
    if (!third || third === 'unit') return `${second}SagUnit`;
    const S = styles.find(([k]) => k === third)?.[1] ?? 'Road';
    return `${second}Sag${S}${fourth === 'rider' ? 'Rider' : 'Static'}`;
  }
  return head ?? '';
}

function parseNumber(raw: string, column: string, problems: CsvProblemDto[], line: number): number | null {
  const t = raw.trim();
  if (t === '') return null;
  const n = Number(t);
  if (!Number.isFinite(n) || !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(t)) {
    problems.push({ line, column, message: `'${t.slice(0, 40)}' is not a number.` });
    return null;
  }
  return n;
}

/** Turns one CSV row into a validated input, collecting every problem with its column. */
function parseRow(cells: Record<string, string>, line: number, problems: CsvProblemDto[], warnings: CsvProblemDto[]): ParsedRow | undefined {
  const before = problems.length;
  for (const [column, value] of Object.entries(cells)) if (!isStorableText(value)) problems.push({ line, column, message: unstorableTextMessage });
  if (problems.length > before) return undefined;
  const num = (c: string) => parseNumber(cells[c] ?? '', c, problems, line);
  const id = (cells.id ?? '').trim();
  if (id && !uuidPattern.test(id)) problems.push({ line, column: 'id', message: 'The id is a UUID, or blank for a new fitment.' });

  const stations: LoadStationKind[] = [];
  const loadStations: { station: LoadStationKind; positionMm: number | null; maxLoadKg: number | null }[] = [];
  for (const s of loadStationKinds) {
    const p = num(`${stationPrefix[s]}PositionMm`);
    const m = num(`${stationPrefix[s]}MaxKg`);
    if (p === null && m === null) continue;
    stations.push(s);
    loadStations.push({ station: s, positionMm: p, maxLoadKg: m });
  }

  let rearLeverageRatio: number | null = null;
  let rearLeverageCurve: { wheelTravelMm: number | null; ratio: number | null }[] | null = null;
  const lev = (cells.rearLeverage ?? '').trim();
  if (lev.includes(':')) {
    rearLeverageCurve = lev.split(';').map((pair) => {
      const [w, r] = pair.split(':');
      return { wheelTravelMm: parseNumber(w ?? '', 'rearLeverage', problems, line), ratio: parseNumber(r ?? '', 'rearLeverage', problems, line) };
    });
  } else {
    rearLeverageRatio = num('rearLeverage');
  }

  const list = (c: string) => (cells[c] ?? '').split('|').map((x) => x.trim()).filter(Boolean);
  const torques = list('torques').map((pair) => {
    const eq = pair.lastIndexOf('=');
    if (eq < 0) {
      problems.push({ line, column: 'torques', message: `'${pair.slice(0, 40)}' is not "fastener=N·m".` });
      return { fastener: pair, torqueNm: null };
    }
    return { fastener: pair.slice(0, eq).trim(), torqueNm: parseNumber(pair.slice(eq + 1), 'torques', problems, line) };
  });

  const sagEnd = (e: (typeof ends)[number]) => ({
    unit: (cells[`${e}SagUnit`] ?? '').trim(),
    ...Object.fromEntries(styles.map(([k, S]) => [k, { static: num(`${e}Sag${S}Static`), rider: num(`${e}Sag${S}Rider`) }])),
  });

  const plain: Record<string, unknown> = {
    make: (cells.make ?? '').trim(),
    model: (cells.model ?? '').trim(),
    variant: (cells.variant ?? '').trim(),
    massInput: (cells.massInput ?? '').trim(),
    loadStations,
    rearLeverageRatio,
    rearLeverageCurve,
    sag: { front: sagEnd('front'), rear: sagEnd('rear') },
    torques,
    tools: list('tools'),
    notes: cells.notes ?? '',
  };
  for (const c of numberColumns) plain[c] = num(c);
  if (problems.length > before) return undefined;

  const dto = plainToInstance(FitmentInputDto, plain);
  const errors = validateSync(dto, { whitelist: true, forbidNonWhitelisted: true });
  const fields = errors.length ? flattenValidationErrors(errors) : fitmentProblems(dto);
  for (const [path, message] of Object.entries(fields)) problems.push({ line, column: columnOf(path, stations), message });
  if (problems.length > before) return undefined;
  for (const [path, message] of Object.entries(fitmentWarnings(dto))) warnings.push({ line, column: columnOf(path, stations), message });
  return { line, id: id ? id.toLowerCase() : null, dto };
}

// Only what an import sets; compared to tell updated rows from unchanged ones.
function comparable(f: Fitment): string {
  const { id: _i, bike: _b, createdAt: _c, updatedAt: _u, ...rest } = f;
  return canonical(rest);
}

// jsonb hands keys back in its own order, so objects are compared with their keys sorted.
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    const o = v as Record<string, unknown>;
    return `{${Object.keys(o).filter((k) => o[k] !== undefined).sort().map((k) => `${JSON.stringify(k)}:${canonical(o[k])}`).join(',')}}`;
  }
  return JSON.stringify(v ?? null);
}

const keyOf = (make: string, model: string, variant: string, yearFrom: number) =>
  `${make.trim().toLowerCase()}\u0000${model.trim().toLowerCase()}\u0000${variant.trim().toLowerCase()}\u0000${yearFrom}`;

/**
 * Checks a fitment CSV and, unless it is a dry run, writes it in one transaction: all rows or none.
 * Rows with an id update that fitment; rows without one create a fitment.
 */
export async function importFitmentsCsv(actorId: string, text: string | undefined, opts: { dryRun: boolean }): Promise<CsvImportReportDto> {
  if (text === undefined) throw AppError.validation('Send the CSV as the request body with Content-Type text/csv.', { body: 'expected text/csv' });
  const problems: CsvProblemDto[] = [];
  const warnings: CsvProblemDto[] = [];
  let records: { info: { lines: number }; record: string[] }[];
  try {
    records = parse(text, { bom: true, info: true, skip_empty_lines: true, relax_column_count: true }) as unknown as typeof records;
  } catch (e) {
    const err = e as { message?: string; lines?: number };
    throw importRefused({ dryRun: opts.dryRun, rows: 0, created: 0, updated: 0, unchanged: 0, problems: [{ line: err.lines ?? 1, column: '', message: `The file is not valid CSV: ${err.message ?? 'unreadable'}` }], warnings: [] });
  }
  const [header, ...body] = records;
  if (!header) throw importRefused({ dryRun: opts.dryRun, rows: 0, created: 0, updated: 0, unchanged: 0, problems: [{ line: 1, column: '', message: 'The file is empty.' }], warnings: [] });
  const names = header.record.map((h) => h.trim());
  for (const n of names) if (!csvColumns.includes(n)) problems.push({ line: 1, column: n, message: 'Unknown column.' });
  for (const c of csvColumns) if (!names.includes(c) && !optionalColumns.includes(c)) problems.push({ line: 1, column: c, message: 'This column is missing.' });
  if (problems.length) throw importRefused({ dryRun: opts.dryRun, rows: body.length, created: 0, updated: 0, unchanged: 0, problems, warnings: [] });

  const parsed: ParsedRow[] = [];
  for (const { info, record } of body) {
    if (record.length !== names.length) {
      problems.push({ line: info.lines, column: '', message: `The row has ${record.length} cells; the header has ${names.length}.` });
      continue;
    }
    const cells = Object.fromEntries(names.map((n, i) => [n, record[i] ?? '']));
    const row = parseRow(cells, info.lines, problems, warnings);
    if (row) parsed.push(row);
  }

  const run = async (em: EntityManager): Promise<CsvImportReportDto> => {
    // Other writers wait until the import commits, so its checks against the table still hold when it writes.
    if (!opts.dryRun) await em.query(`LOCK TABLE fitments IN SHARE ROW EXCLUSIVE MODE`);
    const existing = await allFitments(em);
    const byId = new Map(existing.map((f) => [f.id, f]));
    const keyOwner = new Map(existing.map((f) => [keyOf(f.bike.make, f.bike.model, f.variant, f.yearFrom), f.id]));
    const idsInFile = new Set(parsed.flatMap((r) => (r.id ? [r.id] : [])));
    const seenIds = new Map<string, number>();
    const seenKeys = new Map<string, number>();
    for (const r of parsed) {
      if (r.id) {
        const first = seenIds.get(r.id);
        if (first !== undefined) problems.push({ line: r.line, column: 'id', message: `The same id is on line ${first}.` });
        else seenIds.set(r.id, r.line);
      }
      const key = keyOf(r.dto.make, r.dto.model, r.dto.variant ?? '', r.dto.yearFrom);
      const firstKey = seenKeys.get(key);
      if (firstKey !== undefined) problems.push({ line: r.line, column: 'yearFrom', message: `Line ${firstKey} has the same make, model, variant and first year.` });
      else seenKeys.set(key, r.line);
      const owner = keyOwner.get(key);
      if (owner && owner !== r.id && !idsInFile.has(owner)) {
        problems.push({ line: r.line, column: 'yearFrom', message: `Fitment ${owner} already has this make, model, variant and first year.` });
      }
    }
    problems.sort((a, b) => a.line - b.line);
    const report: CsvImportReportDto = { dryRun: opts.dryRun, rows: body.length, created: 0, updated: 0, unchanged: 0, problems, warnings };
    if (problems.length) return report;

    // Bikes are created up front, in one go, so each row only needs a lookup.
    const bikes = await bikesFor(em, parsed.map((r) => r.dto));
    const creates: Fitment[] = [];
    const updates: { before: FitmentWithBike; after: Fitment }[] = [];
    for (const r of parsed) {
      const bikeId = bikes.get(`${r.dto.make.trim().toLowerCase()}\u0000${r.dto.model.trim().toLowerCase()}`)!;
      const old = r.id ? byId.get(r.id) : undefined;
      const f = em.getRepository(Fitment).create({ id: old?.id ?? r.id ?? randomUUID() });
      applyFitmentInput(f, r.dto, bikeId);
      if (!old) creates.push(f);
      else {
        const { bike: _bike, ...oldFields } = old;
        const merged = Object.assign(em.getRepository(Fitment).create(), oldFields, f);
        if (comparable(merged) === comparable(Object.assign(em.getRepository(Fitment).create(), oldFields))) report.unchanged += 1;
        else updates.push({ before: old, after: merged });
      }
    }
    report.created = creates.length;
    report.updated = updates.length;
    if (opts.dryRun) return report;

    // A key moving from one row to another would trip the unique index mid-update; park the old keys first.
    if (updates.length) {
      await em.query(`UPDATE fitments SET year_from = -year_from - 100000 WHERE id = ANY($1::uuid[])`, [updates.map((u) => u.after.id)]);
    }
    for (let i = 0; i < creates.length; i += 500) await em.getRepository(Fitment).insert(creates.slice(i, i + 500));
    for (const u of updates) {
      const { id, bike: _b, createdAt: _c, updatedAt: _u, ...fields } = u.after;
      await em.getRepository(Fitment).update({ id }, { ...fields, updatedAt: new Date() });
    }
    // The audit keeps the same DTO shape on both sides, read back as saved, as the form's saves do.
    const written = await em
      .getRepository(Fitment)
      .find({ where: { id: In([...creates.map((f) => f.id), ...updates.map((u) => u.after.id)]) }, relations: { bike: true } });
    const savedDto = new Map(written.map((f) => [f.id, toFitmentDto(f as FitmentWithBike)]));
    await recordAudit(
      em,
      ...creates.map((f) => ({ actorId, entityType: 'fitment' as const, entityId: f.id, action: 'import' as const, before: null, after: savedDto.get(f.id)! })),
      ...updates.map((u) => ({ actorId, entityType: 'fitment' as const, entityId: u.after.id, action: 'import' as const, before: toFitmentDto(u.before), after: savedDto.get(u.after.id)! })),
    );
    return report;
  };

  if (opts.dryRun) {
    const report = await run(AppDataSource.manager);
    return report;
  }
  const report = await AppDataSource.transaction(run);
  if (report.problems.length) throw importRefused(report);
  catalogueChanged();
  return report;
}

function importRefused(report: CsvImportReportDto): AppError {
  return new AppError('validation', `The CSV has ${report.problems.length} problem(s); nothing was imported.`, undefined, report);
}

async function bikesFor(em: EntityManager, dtos: FitmentInputDto[]): Promise<Map<string, string>> {
  const pairs = new Map<string, { make: string; model: string }>();
  for (const d of dtos) pairs.set(`${d.make.trim().toLowerCase()}\u0000${d.model.trim().toLowerCase()}`, { make: d.make.trim(), model: d.model.trim() });
  const list = [...pairs.values()];
  if (list.length) {
    await em.query(
      `INSERT INTO bikes (make, model) SELECT * FROM unnest($1::varchar[], $2::varchar[]) ON CONFLICT DO NOTHING`,
      [list.map((p) => p.make), list.map((p) => p.model)],
    );
  }
  const rows = await em.getRepository(Bike).find();
  return new Map(rows.map((b) => [`${b.make.toLowerCase()}\u0000${b.model.toLowerCase()}`, b.id]));
}
