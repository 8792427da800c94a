// Fitment rules across fields, free of class-validator so the staff form runs the server's own checks as staff type.
import { createLeverageCurve, shockTravelAt, type LeverageCurve } from '../engine/leverage';
import { rearRequiredRate } from '../engine/rear';
import { g } from '../units';
import { riderRanges } from './ranges';

type N = number | null | undefined;

interface SagPairRule {
  static: N;
  rider: N;
}
interface SagEndRule {
  unit: 'mm' | 'pct';
  road?: SagPairRule;
  adventure?: SagPairRule;
  offRoad?: SagPairRule;
}

/**
 * What the cross-field rules read: a validated `FitmentInputDto`, or the client's half-filled form, where a
 * blank number skips only the rules that need it.
 */
export interface FitmentRuleFields {
  yearFrom: N;
  yearTo: N;
  massInput: 'sprung' | 'wet';
  wetMassKg?: N;
  frontStaticSharePct?: N;
  frontUnsprungMassKg?: N;
  rearUnsprungMassKg?: N;
  rearSprungMassKg?: N;
  wheelbaseMm?: N;
  loadStations: readonly { station: string; positionMm?: N }[];
  rearLeverageRatio?: N;
  rearLeverageCurve?: readonly { wheelTravelMm: N; ratio?: N }[] | null;
  rearWheelTravelMm: N;
  shockStrokeMm: N;
  rearPreloadMinMm: N;
  rearPreloadMaxMm: N;
  forkPreloadMinMm: N;
  forkPreloadMaxMm: N;
  shockSpringFreeLengthMinMm: N;
  shockSpringFreeLengthMaxMm: N;
  forkSpringFreeLengthMinMm: N;
  forkSpringFreeLengthMaxMm: N;
  forkTravelMm: N;
  forkStockPreloadMm?: N;
  sag?: { front?: SagEndRule; rear?: SagEndRule };
}

/** A ratio or curve may ask the shock for at most this share more than its stroke at full wheel travel (rounding in makers' figures). */
export const strokeOverrunShare = 0.01;
/** More than this share of the stroke left unused at full wheel travel is worth a second look. */
export const strokeUnusedShare = 0.15;

const isNum = (v: N): v is number => typeof v === 'number' && Number.isFinite(v);

/**
 * Derived sprung masses from wet mass, static front share and unsprung masses, kg.
 * @example sprungFromWet(200, 50, 15, 20) // { frontSprungMassKg: 85, rearSprungMassKg: 80 }
 */
export function sprungFromWet(wetMassKg: number, frontSharePct: number, frontUnsprungKg: number, rearUnsprungKg: number) {
  return {
    frontSprungMassKg: (wetMassKg * frontSharePct) / 100 - frontUnsprungKg,
    rearSprungMassKg: (wetMassKg * (100 - frontSharePct)) / 100 - rearUnsprungKg,
  };
}

/**
 * `sprungFromWet` for a form that may still be blank: null until all four are numbers.
 * @example sprungFromWetOrNull({ wetMassKg: 200, frontStaticSharePct: null, frontUnsprungMassKg: 15, rearUnsprungMassKg: 20 }) // null
 */
export function sprungFromWetOrNull(f: { wetMassKg?: N; frontStaticSharePct?: N; frontUnsprungMassKg?: N; rearUnsprungMassKg?: N }) {
  const { wetMassKg: w, frontStaticSharePct: s, frontUnsprungMassKg: fu, rearUnsprungMassKg: ru } = f;
  return isNum(w) && isNum(s) && isNum(fu) && isNum(ru) ? sprungFromWet(w, s, fu, ru) : null;
}

/**
 * Rules across fields that class-validator cannot say per field; returns `{field: message}`, empty when fine.
 * @example fitmentProblems({ ...input, yearTo: input.yearFrom - 1 }) // { yearTo: 'The last year is not before the first.' }
 */
export function fitmentProblems(f: FitmentRuleFields): Record<string, string> {
  const p: Record<string, string> = {};
  const below = (a: N, b: N) => isNum(a) && isNum(b) && a < b;
  if (below(f.yearTo, f.yearFrom)) p.yearTo = 'The last year is not before the first.';
  if (f.rearLeverageRatio != null && f.rearLeverageCurve != null) p.rearLeverageCurve = 'Give a single leverage ratio or a curve, not both.';
  if (below(f.rearPreloadMaxMm, f.rearPreloadMinMm)) p.rearPreloadMaxMm = 'The maximum is not below the minimum.';
  if (below(f.forkPreloadMaxMm, f.forkPreloadMinMm)) p.forkPreloadMaxMm = 'The maximum is not below the minimum.';
  if (below(f.shockSpringFreeLengthMaxMm, f.shockSpringFreeLengthMinMm)) p.shockSpringFreeLengthMaxMm = 'The longest is not below the shortest.';
  if (below(f.forkSpringFreeLengthMaxMm, f.forkSpringFreeLengthMinMm)) p.forkSpringFreeLengthMaxMm = 'The longest is not below the shortest.';
  if (below(f.forkPreloadMaxMm, f.forkStockPreloadMm) || below(f.forkStockPreloadMm, f.forkPreloadMinMm)) {
    p.forkStockPreloadMm = 'The stock preload lies within the fork preload range.';
  }
  f.rearLeverageCurve?.forEach((pt, i) => {
    const prev = f.rearLeverageCurve?.[i - 1];
    if (prev && isNum(prev.wheelTravelMm) && isNum(pt.wheelTravelMm) && !(pt.wheelTravelMm > prev.wheelTravelMm)) {
      p[`rearLeverageCurve.${i}.wheelTravelMm`] = 'Points go in increasing wheel travel.';
    }
  });
  const seen = new Set<string>();
  f.loadStations.forEach((s, i) => {
    if (seen.has(s.station)) p[`loadStations.${i}.station`] = 'Each station appears once.';
    seen.add(s.station);
  });
  if (!seen.has('rider')) p.loadStations = 'The rider seat is needed.';
  Object.assign(p, stationProblems(f));
  const sprung = f.massInput === 'wet' ? sprungFromWetOrNull(f) : null;
  if (sprung && sprung.frontSprungMassKg < 20) p.frontUnsprungMassKg = 'This leaves less than 20 kg sprung on the front.';
  if (sprung && sprung.rearSprungMassKg < 20) p.rearUnsprungMassKg = 'This leaves less than 20 kg sprung on the rear.';
  const steep = steepCurveProblem(f, f.massInput === 'wet' ? sprung?.rearSprungMassKg : f.rearSprungMassKg);
  if (steep && !p.rearLeverageCurve) p.rearLeverageCurve = steep;
  // After the steep-curve rule: a curve no spring can use is named for that first.
  const stroke = strokeUse(f);
  if (stroke && !p[stroke.field] && stroke.shockTravelMm > stroke.strokeMm * (1 + strokeOverrunShare)) {
    p[stroke.field] =
      `At full wheel travel this ${stroke.field === 'rearLeverageRatio' ? 'ratio' : 'curve'} moves the shock ${mm1(stroke.shockTravelMm)} mm, more than its ${mm1(stroke.strokeMm)} mm stroke: check the ratio, the wheel travel and the stroke.`;
  }
  for (const end of ['front', 'rear'] as const) {
    const e = f.sag?.[end];
    if (!e) continue;
    const travel = end === 'front' ? f.forkTravelMm : f.rearWheelTravelMm;
    for (const style of ['road', 'adventure', 'offRoad'] as const) {
      const pair = e[style];
      if (!pair) continue;
      if (isNum(pair.static) && isNum(pair.rider) && pair.static >= pair.rider) p[`sag.${end}.${style}.static`] = 'Static sag is less than rider sag.';
      if (isNum(pair.rider) && isNum(travel)) {
        const riderMm = e.unit === 'pct' ? (pair.rider / 100) * travel : pair.rider;
        if (riderMm >= travel * 0.6) p[`sag.${end}.${style}.rider`] = 'Rider sag is less than 60 % of the travel.';
      }
    }
  }
  return p;
}

const mm1 = (v: number) => String(Math.round(v * 10) / 10);

/** The leverage as a curve, or undefined while the form lacks a usable ratio or curve. */
function leverageOf(f: Pick<FitmentRuleFields, 'rearLeverageRatio' | 'rearLeverageCurve'>): { curve: LeverageCurve; field: 'rearLeverageRatio' | 'rearLeverageCurve' } | undefined {
  if (f.rearLeverageCurve) {
    const points: { wheelTravelMm: number; ratio: number }[] = [];
    for (const pt of f.rearLeverageCurve) {
      const last = points[points.length - 1];
      if (!isNum(pt.wheelTravelMm) || !isNum(pt.ratio) || !(pt.ratio > 0) || (last && !(pt.wheelTravelMm > last.wheelTravelMm))) return undefined;
      points.push({ wheelTravelMm: pt.wheelTravelMm, ratio: pt.ratio });
    }
    return points.length ? { curve: createLeverageCurve(points), field: 'rearLeverageCurve' } : undefined;
  }
  return isNum(f.rearLeverageRatio) && f.rearLeverageRatio > 0 ? { curve: createLeverageCurve(f.rearLeverageRatio), field: 'rearLeverageRatio' } : undefined;
}

/**
 * How much of the shock's stroke the leverage uses at full wheel travel: travel ÷ ratio, or ∫ ds / LR(s) over the
 * travel for a curve (exact for the piecewise-linear curve). Undefined while a figure is missing.
 * @example strokeUse({ rearLeverageRatio: 2.6, rearWheelTravelMm: 210, shockStrokeMm: 76 }) // { shockTravelMm: 80.77, strokeMm: 76, … }
 */
export function strokeUse(f: Pick<FitmentRuleFields, 'rearLeverageRatio' | 'rearLeverageCurve' | 'rearWheelTravelMm' | 'shockStrokeMm'>):
  { shockTravelMm: number; strokeMm: number; usedShare: number; field: 'rearLeverageRatio' | 'rearLeverageCurve' } | undefined {
  const lev = leverageOf(f);
  if (!lev || !isNum(f.rearWheelTravelMm) || !isNum(f.shockStrokeMm) || !(f.shockStrokeMm > 0)) return undefined;
  const shockTravelMm = shockTravelAt(lev.curve, f.rearWheelTravelMm) - shockTravelAt(lev.curve, 0);
  return { shockTravelMm, strokeMm: f.shockStrokeMm, usedShare: shockTravelMm / f.shockStrokeMm, field: lev.field };
}

/** The rider's seat sits between the axles and a passenger's behind the rider; positions are from the front axle. */
function stationProblems(f: FitmentRuleFields): Record<string, string> {
  const p: Record<string, string> = {};
  const i = f.loadStations.findIndex((s) => s.station === 'rider');
  const j = f.loadStations.findIndex((s) => s.station === 'passenger');
  const rider = f.loadStations[i]?.positionMm;
  const passenger = f.loadStations[j]?.positionMm;
  if (isNum(rider) && isNum(f.wheelbaseMm) && !(rider > 0 && rider < f.wheelbaseMm)) {
    p[`loadStations.${i}.positionMm`] = `The rider's seat sits between the axles: more than 0 and less than the ${mm1(f.wheelbaseMm)} mm wheelbase from the front axle.`;
  }
  if (isNum(passenger) && isNum(rider) && !(passenger > rider)) {
    p[`loadStations.${j}.positionMm`] = `The passenger sits behind the rider, further back than the rider's ${mm1(rider)} mm.`;
  }
  return p;
}

/**
 * What staff should look at twice but may save: a leverage that leaves more than 15 % of the shock's stroke unused at
 * full wheel travel, and a fork without an adjuster whose stock spacer is not known (no spacer length can be given).
 * @example fitmentWarnings({ ...input, shockStrokeMm: 100 }) // { shockStrokeMm: 'At full wheel travel the shock uses 76.9 of its 100 mm stroke …' }
 */
export function fitmentWarnings(f: FitmentRuleFields & { forkAdjusterPitchMm?: N; forkStockSpacerMm?: N }): Record<string, string> {
  const w: Record<string, string> = {};
  const stroke = strokeUse(f);
  if (stroke && stroke.usedShare < 1 - strokeUnusedShare) {
    w.shockStrokeMm = `At full wheel travel the shock uses ${mm1(stroke.shockTravelMm)} of its ${mm1(stroke.strokeMm)} mm stroke (${Math.round(stroke.usedShare * 100)} %); check the ratio, the wheel travel and the stroke.`;
  }
  if ('forkAdjusterPitchMm' in f && f.forkAdjusterPitchMm == null && f.forkStockSpacerMm == null) {
    w.forkStockSpacerMm = 'This fork has no preload adjuster: give the stock spacer length so riders are told the spacer to cut.';
  }
  return w;
}

const styleNames = { road: 'road', adventure: 'adventure', offRoad: 'off-road' } as const;

/**
 * A leverage curve that falls so steeply between static and rider sag that the shock would have to push less at
 * rider sag: no spring meets the targets. Checked with the lightest rider the API accepts on the rider seat;
 * a heavier load only raises the rate asked, so if this passes no rider can be refused for the curve.
 */
function steepCurveProblem(f: FitmentRuleFields, rearSprungKg: N): string | undefined {
  const pts = f.rearLeverageCurve;
  const seat = f.loadStations.find((s) => s.station === 'rider')?.positionMm;
  const rear = f.sag?.rear;
  const travel = f.rearWheelTravelMm;
  if (!pts || pts.length < 2 || !rear || !isNum(rearSprungKg) || !isNum(seat) || !(seat > 0) || !isNum(f.wheelbaseMm) || !isNum(travel)) return undefined;
  const points: { wheelTravelMm: number; ratio: number }[] = [];
  for (const pt of pts) {
    const last = points[points.length - 1];
    if (!isNum(pt.wheelTravelMm) || !isNum(pt.ratio) || !(pt.ratio > 0) || (last && !(pt.wheelTravelMm > last.wheelTravelMm))) return undefined;
    points.push({ wheelTravelMm: pt.wheelTravelMm, ratio: pt.ratio });
  }
  const curve = createLeverageCurve(points);
  const bikeN = g * rearSprungKg;
  const totalN = bikeN + (g * riderRanges.massKg.min * seat) / f.wheelbaseMm;
  for (const style of ['road', 'adventure', 'offRoad'] as const) {
    const pair = rear[style];
    if (!pair || !isNum(pair.static) || !isNum(pair.rider) || !(pair.static < pair.rider)) continue;
    const mm = (v: number) => (rear.unit === 'pct' ? (v / 100) * travel : v);
    if (!(rearRequiredRate(curve, bikeN, totalN, { staticSagMm: mm(pair.static), riderSagMm: mm(pair.rider) }) > 0)) {
      return `With this curve no shock spring can give the ${styleNames[style]} sag targets: the ratio falls too steeply between static and rider sag, so the shock would have to push less at rider sag.`;
    }
  }
  return undefined;
}
