import type { LuggageStation } from '@shared/catalogue/constants';

/** What a setup-sheet link carries: a bike, a load and the chosen springs (the finder's plan or a saved bike). */
export interface SheetPlan {
  fitmentId: string;
  ridingStyle: string;
  riderKg: number;
  gearKg?: number | null;
  passengerKg?: number | null;
  luggageKg?: Partial<Record<LuggageStation, number | null>>;
  forkId?: string | null;
  shockId?: string | null;
}

const luggageParams: Record<LuggageStation, string> = { 'tank-bag': 'tankBagKg', panniers: 'panniersKg', 'top-case': 'topCaseKg' };

/**
 * The query of /setup-sheet and of GET /api/setup-sheet(/pdf): flat names, kg, product ids.
 * @example setupSheetQuery({ fitmentId, ridingStyle: 'road', riderKg: 95, gearKg: 8, luggageKg: { panniers: 20 }, forkId, shockId })
 * // { fitmentId, ridingStyle: 'road', riderKg: '95', gearKg: '8', panniersKg: '20', forkId, shockId }
 */
export function setupSheetQuery(p: SheetPlan): Record<string, string> {
  const q: Record<string, string> = { fitmentId: p.fitmentId, ridingStyle: p.ridingStyle, riderKg: String(p.riderKg) };
  if (p.gearKg) q.gearKg = String(p.gearKg);
  if (p.passengerKg) q.passengerKg = String(p.passengerKg);
  for (const [station, name] of Object.entries(luggageParams) as [LuggageStation, string][]) {
    const kg = p.luggageKg?.[station];
    if (kg) q[name] = String(kg);
  }
  if (p.forkId) q.forkId = p.forkId;
  if (p.shockId) q.shockId = p.shockId;
  return q;
}

/** The query back from a route's query, keeping only the sheet's own names. */
export function sheetQueryFromRoute(query: Record<string, unknown>): Record<string, string> | null {
  const names = ['fitmentId', 'ridingStyle', 'riderKg', 'gearKg', 'passengerKg', ...Object.values(luggageParams), 'forkId', 'shockId'];
  const out: Record<string, string> = {};
  for (const n of names) if (typeof query[n] === 'string' && query[n]) out[n] = query[n];
  return out.fitmentId ? out : null;
}
