/**
 * One-off design aid for the demo catalogue: writes seeds/data/fitments.json and seeds/data/products.json.
 * Bikes, makes and shop are invented. Their figures are typical of each class of motorcycle, from memory (no
 * maker's sheet was used); seeds/README.md says where each figure comes from. For every bike, end and riding style
 * the tool picks the static-sag target that leaves the widest band of suiting rates over the whole rider grid
 * (55–120 kg with 8 kg of gear, solo, and two-up with a 70 kg passenger where the bike has the seat and the rated
 * load), then picks each spring family's rate ladder so that every load of the grid has a suiting rate, and solves
 * each spring's wire and coils so the engine's geometry gives its stated rate and closing it to solid stays within
 * the allowable stress of Shigley 10th ed. Table 10-6.
 * Run: npx tsx --tsconfig tsconfig.server.json seeds/tools/design-catalogue.ts [--write]
 */
import { writeFileSync } from 'node:fs';
import { computeSpringGeometry, shearModulusFor } from '../../shared/engine';
import { checkSolidStress, minTensileStrength } from '../../shared/engine/spring-strength';
import { shockTravelAt } from '../../shared/engine/leverage';
import type { FitmentInputDto, ProductInputDto } from '../../shared/catalogue';
import { gridGearKg, gridLoadsFor } from '../grid';
import { createLeverageCurve, g, rateBand, riderLoadOn, suits, type Band, type EndDesign } from './design-band';

type Style = 'road' | 'adventure' | 'offRoad';
const styles: Style[] = ['road', 'adventure', 'offRoad'];
type Curve = { wheelTravelMm: number; ratio: number }[];

interface Family { id: string; end: 'fork' | 'shock'; innerMm: number; freeMm: number; step: number; material: 'chrome-silicon' | 'chrome-vanadium' }
const families: Family[] = [
  { id: 'FA', end: 'fork', innerMm: 27.5, freeMm: 360, step: 0.5, material: 'chrome-silicon' },
  { id: 'FB', end: 'fork', innerMm: 27.5, freeMm: 440, step: 0.5, material: 'chrome-silicon' },
  { id: 'FC', end: 'fork', innerMm: 29, freeMm: 520, step: 0.2, material: 'chrome-silicon' },
  { id: 'FD', end: 'fork', innerMm: 29, freeMm: 580, step: 0.2, material: 'chrome-silicon' },
  { id: 'SA', end: 'shock', innerMm: 56, freeMm: 260, step: 5, material: 'chrome-silicon' },
  { id: 'SB', end: 'shock', innerMm: 61, freeMm: 290, step: 5, material: 'chrome-silicon' },
  { id: 'SC', end: 'shock', innerMm: 61, freeMm: 310, step: 5, material: 'chrome-silicon' },
  { id: 'SD', end: 'shock', innerMm: 56, freeMm: 320, step: 5, material: 'chrome-silicon' },
  { id: 'SE', end: 'shock', innerMm: 42, freeMm: 260, step: 1, material: 'chrome-silicon' },
];
const fam = (id: string) => families.find((f) => f.id === id)!;

/** Rider sag as a share of travel per riding style (common practice: a quarter to a third of the travel). */
type Shares = Record<Style, number>;

interface Klass {
  wheelbase: number; wet: number; frontShare: number; unsprungF: number; unsprungR: number; rated: number;
  /** Stations as a share of the wheelbase from the front axle (rider 55–62 %, passenger 75–85 %: common practice, from memory). */
  rider: number; passenger?: number; tank?: number; panniers?: number; topCase?: number;
  /** A curve, or the share of the stroke a constant ratio uses at full travel (ratio = travel ÷ (stroke × share)). */
  lev: Curve | { strokeUsed: number }; wheelTravel: number; stroke: number; shockCount: 1 | 2;
  rearPre: [number, number]; pitch: number; forkAngle: number; forkTravel: number; forkPre: [number, number]; forkPitch: number | null;
  forkStockPre: number; forkSpacer: number | null;
  fork: string; shock: string; shareF: Shares; shareR: Shares; tolF: number; tolR: number; torques: [string, number][];
}

const roadTorques: [string, number][] = [['Fork cap', 23], ['Top clamp pinch bolt', 20], ['Bottom clamp pinch bolt', 18], ['Shock upper bolt', 44], ['Shock lower bolt', 44]];
const road: Klass = {
  wheelbase: 1430, wet: 192, frontShare: 50, unsprungF: 16, unsprungR: 20, rated: 185, rider: 0.57, passenger: 0.8, tank: 0.31, panniers: 0.93, topCase: 1.06,
  lev: { strokeUsed: 0.97 }, wheelTravel: 130, stroke: 67, shockCount: 1, rearPre: [3, 18], pitch: 1.5,
  forkAngle: 25, forkTravel: 125, forkPre: [8, 24], forkPitch: 1, forkStockPre: 14, forkSpacer: null,
  fork: 'FA', shock: 'SA', shareF: { road: 0.26, adventure: 0.28, offRoad: 0.3 }, shareR: { road: 0.27, adventure: 0.29, offRoad: 0.31 },
  tolF: 4, tolR: 4, torques: roadTorques,
};
const sportTour: Klass = {
  ...road, wheelbase: 1480, wet: 235, frontShare: 50, unsprungF: 18, unsprungR: 24, rated: 200, rider: 0.58, passenger: 0.81, tank: undefined, panniers: 0.94, topCase: 1.07,
  wheelTravel: 135, stroke: 68, forkAngle: 24.5, forkTravel: 130, fork: 'FB', shock: 'SB',
};
const adv: Klass = {
  wheelbase: 1540, wet: 228, frontShare: 49, unsprungF: 19, unsprungR: 25, rated: 215, rider: 0.6, passenger: 0.82, tank: 0.32, panniers: 0.93, topCase: 1.08,
  lev: { strokeUsed: 0.97 }, wheelTravel: 210, stroke: 86, shockCount: 1, rearPre: [4, 26], pitch: 1.5,
  forkAngle: 27, forkTravel: 210, forkPre: [12, 30], forkPitch: 1, forkStockPre: 18, forkSpacer: null,
  fork: 'FC', shock: 'SB', shareF: { road: 0.27, adventure: 0.29, offRoad: 0.31 }, shareR: { road: 0.29, adventure: 0.31, offRoad: 0.33 },
  tolF: 6, tolR: 6,
  torques: [['Fork cap', 30], ['Top clamp pinch bolt', 17], ['Bottom clamp pinch bolt', 15], ['Shock upper bolt', 50], ['Shock lower bolt', 50], ['Front axle nut', 70]],
};
const bigAdv: Klass = {
  ...adv, wheelbase: 1580, wet: 262, frontShare: 48, unsprungF: 21, unsprungR: 28, rated: 225, rider: 0.61, passenger: 0.83, panniers: 0.94, topCase: 1.08,
  lev: [{ wheelTravelMm: 0, ratio: 2.7 }, { wheelTravelMm: 100, ratio: 2.5 }, { wheelTravelMm: 220, ratio: 2.3 }], wheelTravel: 220, stroke: 90, rearPre: [4, 28], forkPre: [14, 32], tolF: 7,
  fork: 'FC', shock: 'SC', forkTravel: 210,
};
const offRoad: Klass = {
  wheelbase: 1480, wet: 145, frontShare: 48, unsprungF: 14, unsprungR: 17, rated: 140, rider: 0.56, passenger: undefined, tank: undefined, panniers: undefined,
  lev: [{ wheelTravelMm: 0, ratio: 3.3 }, { wheelTravelMm: 150, ratio: 3.0 }, { wheelTravelMm: 290, ratio: 2.6 }], wheelTravel: 290, stroke: 100, shockCount: 1,
  rearPre: [4, 22], pitch: 1.5, forkAngle: 27, forkTravel: 280, forkPre: [4, 34], forkPitch: null, forkStockPre: 10, forkSpacer: 110,
  fork: 'FD', shock: 'SD', shareF: { road: 0.24, adventure: 0.26, offRoad: 0.28 }, shareR: { road: 0.3, adventure: 0.32, offRoad: 0.34 },
  tolF: 8, tolR: 8,
  torques: [['Fork cap', 30], ['Top clamp pinch bolt', 17], ['Bottom clamp pinch bolt', 12], ['Shock upper bolt', 48], ['Linkage bolt', 60]],
};
const dualSport: Klass = {
  ...offRoad, wet: 168, wheelbase: 1500, rated: 170, rider: 0.57, passenger: 0.79, tank: 0.33, panniers: 0.92,
  lev: { strokeUsed: 0.97 }, wheelTravel: 240, stroke: 84, forkTravel: 240, fork: 'FD', shock: 'SD', forkPitch: 1, forkSpacer: null, forkPre: [8, 26], forkStockPre: 14,
  shareF: { road: 0.25, adventure: 0.27, offRoad: 0.29 }, shareR: { road: 0.29, adventure: 0.31, offRoad: 0.33 }, tolF: 7, tolR: 7,
};
const tourer: Klass = {
  ...sportTour, wheelbase: 1620, wet: 330, frontShare: 47, unsprungF: 24, unsprungR: 32, rated: 230, rider: 0.6, passenger: 0.84, panniers: 0.95, topCase: 1.09,
  wheelTravel: 125, stroke: 66, rearPre: [3, 22], forkAngle: 27, forkTravel: 130, forkPre: [14, 32], forkStockPre: 20, tolF: 5, fork: 'FB', shock: 'SC', shareF: { road: 0.26, adventure: 0.28, offRoad: 0.3 }, shareR: { road: 0.27, adventure: 0.29, offRoad: 0.31 },
};
/** A classic roadster on twin shocks: short travel, ratio a little over 1 since the shocks sit near the axle. */
const classic: Klass = {
  ...road, wheelbase: 1440, wet: 198, rated: 180, rider: 0.58, passenger: 0.8, panniers: 0.94, topCase: undefined,
  lev: { strokeUsed: 0.95 }, wheelTravel: 90, stroke: 75, shockCount: 2, rearPre: [3, 15], pitch: 3, forkTravel: 130, forkPitch: null, forkPre: [4, 34], forkStockPre: 14, forkSpacer: 120,
  shock: 'SE', torques: [['Fork cap', 23], ['Top clamp pinch bolt', 20], ['Bottom clamp pinch bolt', 18], ['Shock upper nut', 35], ['Shock lower nut', 35]],
};

const bikes: { make: string; model: string; variant?: string; years: [number, number]; k: Klass; mass: 'wet' | 'sprung'; tweak?: Partial<Klass> }[] = [
  { make: 'Corvane', model: 'Strada 650', years: [2017, 2020], k: road, mass: 'wet' },
  { make: 'Corvane', model: 'Strada 650', years: [2021, 2025], k: road, mass: 'wet', tweak: { wet: 196, forkPitch: null, forkSpacer: 95, forkPre: [4, 34], rider: 0.58 } },
  { make: 'Corvane', model: 'Ridgeline 800', years: [2019, 2022], k: adv, mass: 'sprung' },
  { make: 'Corvane', model: 'Ridgeline 800', variant: 'Rally', years: [2023, 2025], k: adv, mass: 'sprung', tweak: { wheelTravel: 230, stroke: 94, forkTravel: 230, wet: 232, rider: 0.59, forkPre: [14, 32] } },
  { make: 'Haldris', model: 'Tempest 1000', years: [2016, 2021], k: sportTour, mass: 'wet' },
  { make: 'Haldris', model: 'Nomad 1200', years: [2018, 2023], k: bigAdv, mass: 'wet' },
  { make: 'Haldris', model: 'Nomad 1200', variant: 'Low', years: [2020, 2023], k: bigAdv, mass: 'wet',
    tweak: { wheelTravel: 190, forkTravel: 190, stroke: 79, lev: [{ wheelTravelMm: 0, ratio: 2.65 }, { wheelTravelMm: 100, ratio: 2.45 }, { wheelTravelMm: 190, ratio: 2.3 }], rider: 0.6 } },
  { make: 'Haldris', model: 'Kite 390', years: [2020, 2025], k: road, mass: 'sprung', tweak: { wet: 168, wheelbase: 1360, rated: 165, rider: 0.56, passenger: 0.78 } },
  { make: 'Brenmoor', model: 'Scrambler 900', years: [2016, 2022], k: road, mass: 'wet', tweak: { wet: 215, wheelbase: 1470, wheelTravel: 150, stroke: 74, forkTravel: 150, fork: 'FB', shock: 'SA', rider: 0.59, passenger: 0.82 } },
  { make: 'Brenmoor', model: 'Classic 500', years: [2012, 2019], k: classic, mass: 'wet' },
  { make: 'Brenmoor', model: 'Classic 500', years: [2020, 2025], k: classic, mass: 'wet', tweak: { wet: 196, forkPitch: 1, forkSpacer: null, forkPre: [8, 24], rider: 0.57 } },
  { make: 'Ostrel', model: 'Apex 690', years: [2019, 2024], k: dualSport, mass: 'sprung' },
  { make: 'Ostrel', model: 'Terra 890', years: [2021, 2025], k: adv, mass: 'wet', tweak: { wet: 216, stroke: 84, forkAngle: 26.5, rider: 0.61 } },
  { make: 'Ostrel', model: 'Sting 450', years: [2020, 2025], k: offRoad, mass: 'sprung' },
  { make: 'Vantor', model: 'GT 1300', years: [2014, 2020], k: tourer, mass: 'wet' },
  { make: 'Vantor', model: 'GT 1300', years: [2021, 2025], k: tourer, mass: 'wet', tweak: { wet: 338, rider: 0.61 } },
  { make: 'Vantor', model: 'Street 750', years: [2018, 2025], k: road, mass: 'wet', tweak: { wet: 205, stroke: 66, rider: 0.56, passenger: 0.77 } },
  { make: 'Kestrune', model: 'Dune 350', years: [2015, 2025], k: dualSport, mass: 'sprung', tweak: { wet: 152, rated: 160, rider: 0.58 } },
  { make: 'Kestrune', model: 'Meridian 700', years: [2019, 2025], k: adv, mass: 'wet', tweak: { wet: 210 } },
  { make: 'Kestrune', model: 'Meridian 700', variant: 'Tour', years: [2021, 2025], k: adv, mass: 'wet', tweak: { wet: 224, rider: 0.59, passenger: 0.8, panniers: 0.95 } },
];

const r1 = (n: number) => Math.round(n * 10) / 10;
const r2 = (n: number) => Math.round(n * 100) / 100;

interface Designed {
  k: Klass;
  dto: FitmentInputDto;
  families: { fork: string; shock: string };
  curve: ReturnType<typeof createLeverageCurve>;
}

function designFitment(b: (typeof bikes)[number]): Designed {
  const k: Klass = { ...b.k, ...b.tweak };
  const ff = fam(k.fork);
  const sf = fam(k.shock);
  const curvePts = Array.isArray(k.lev) ? k.lev : null;
  const ratio = curvePts ? null : r2(k.wheelTravel / (k.stroke * (k.lev as { strokeUsed: number }).strokeUsed));
  const curve = createLeverageCurve(curvePts ?? ratio!);
  const wb = k.wheelbase;
  const stations: FitmentInputDto['loadStations'] = [{ station: 'rider', positionMm: Math.round(k.rider * wb), maxLoadKg: 150 }];
  if (k.passenger) stations.push({ station: 'passenger', positionMm: Math.round(k.passenger * wb), maxLoadKg: 110 });
  if (k.tank) stations.push({ station: 'tank-bag', positionMm: Math.round(k.tank * wb), maxLoadKg: 8 });
  if (k.panniers) stations.push({ station: 'panniers', positionMm: Math.round(k.panniers * wb), maxLoadKg: k.rated > 200 ? 50 : 30 });
  if (k.topCase) stations.push({ station: 'top-case', positionMm: Math.round(k.topCase * wb), maxLoadKg: 10 });
  const sprungF = r1((k.wet * k.frontShare) / 100 - k.unsprungF);
  const sprungR = r1((k.wet * (100 - k.frontShare)) / 100 - k.unsprungR);
  const dto = {
    make: b.make, model: b.model, variant: b.variant ?? '', yearFrom: b.years[0], yearTo: b.years[1], massInput: b.mass,
    ...(b.mass === 'wet'
      ? { wetMassKg: k.wet, frontStaticSharePct: k.frontShare, frontUnsprungMassKg: k.unsprungF, rearUnsprungMassKg: k.unsprungR }
      : { frontSprungMassKg: sprungF, rearSprungMassKg: sprungR }),
    ratedLoadKg: k.rated, wheelbaseMm: wb, loadStations: stations,
    ...(curvePts ? { rearLeverageCurve: curvePts } : { rearLeverageRatio: ratio }),
    rearWheelTravelMm: k.wheelTravel, shockStrokeMm: k.stroke, shockCount: k.shockCount,
    rearPreloadMinMm: k.rearPre[0], rearPreloadMaxMm: k.rearPre[1], rearAdjusterPitchMm: k.pitch,
    shockSpringInnerDiameterMm: sf.innerMm, shockSpringFreeLengthMinMm: sf.freeMm - 10, shockSpringFreeLengthMaxMm: sf.freeMm + 10,
    forkAngleDeg: k.forkAngle, forkTravelMm: k.forkTravel, forkSpringCount: 2, forkPreloadMinMm: k.forkPre[0], forkPreloadMaxMm: k.forkPre[1],
    forkAdjusterPitchMm: k.forkPitch, forkStockSpacerMm: k.forkSpacer, forkStockPreloadMm: k.forkStockPre,
    forkSpringInnerDiameterMm: ff.innerMm, forkSpringFreeLengthMinMm: ff.freeMm - 10, forkSpringFreeLengthMaxMm: ff.freeMm + 10,
    sag: { front: { unit: 'mm' }, rear: { unit: 'mm' } },
    frontStaticSagToleranceMm: k.tolF, rearStaticSagToleranceMm: k.tolR,
    stockForkRateNPerMm: 0, stockForkFreeLengthMm: ff.freeMm, stockShockRateNPerMm: 0, stockShockFreeLengthMm: sf.freeMm,
    torques: k.torques.map(([fastener, torqueNm]) => ({ fastener, torqueNm })),
    tools: ['Spring compressor', 'Sag measuring tool', 'Fork cap socket', 'Torque wrench'],
    notes: '',
  } as unknown as FitmentInputDto;
  return { k, dto, families: { fork: k.fork, shock: k.shock }, curve };
}

/** Every load of the grid on one bike, placed on its stations. */
function gridLoads(f: FitmentInputDto): { label: string; loads: { massKg: number; positionMm: number }[] }[] {
  const rider = f.loadStations.find((s) => s.station === 'rider')!;
  const pillion = f.loadStations.find((s) => s.station === 'passenger');
  return gridLoadsFor(f).map((l) => ({
    label: `${l.riderKg} kg ${l.passengerKg ? 'two-up' : 'solo'}`,
    loads: [{ massKg: l.riderKg + gridGearKg, positionMm: rider.positionMm }, ...(l.passengerKg ? [{ massKg: l.passengerKg, positionMm: pillion!.positionMm }] : [])],
  }));
}

const sprungOf = (f: FitmentInputDto) =>
  f.massInput === 'wet'
    ? { front: (f.wetMassKg! * f.frontStaticSharePct!) / 100 - f.frontUnsprungMassKg!, rear: (f.wetMassKg! * (100 - f.frontStaticSharePct!)) / 100 - f.rearUnsprungMassKg! }
    : { front: f.frontSprungMassKg!, rear: f.rearSprungMassKg! };

function endDesign(d: Designed, end: 'fork' | 'shock', loads: { massKg: number; positionMm: number }[], targets: { staticSagMm: number; riderSagMm: number }): EndDesign {
  const f = d.dto;
  const sprung = sprungOf(f);
  return end === 'fork'
    ? { end, bikeLoadN: g * sprung.front, riderLoadN: riderLoadOn('fork', f.wheelbaseMm, loads), targets, toleranceMm: f.frontStaticSagToleranceMm!,
        preloadRangeMm: { min: f.forkPreloadMinMm, max: f.forkPreloadMaxMm }, cosAngle: Math.cos((f.forkAngleDeg * Math.PI) / 180), count: 2, travelMm: f.forkTravelMm }
    : { end, bikeLoadN: g * sprung.rear, riderLoadN: riderLoadOn('shock', f.wheelbaseMm, loads), targets, toleranceMm: f.rearStaticSagToleranceMm!,
        preloadRangeMm: { min: f.rearPreloadMinMm, max: f.rearPreloadMaxMm }, curve: d.curve, count: f.shockCount ?? 1, travelMm: f.rearWheelTravelMm };
}

/** Free lengths a family is made in, against the stock spring's: a longer spring in the same adjuster window runs more preload. */
export const lengthOffsetsMm = [-10, 0, 10] as const;
type Bands = Band[]; // one per offset; { min: 1, max: 1 } where nothing suits
const none: Band = { min: 1, max: 1 };
function shifted(e: EndDesign, o: number): EndDesign {
  return { ...e, preloadRangeMm: { min: e.preloadRangeMm.min + o, max: e.preloadRangeMm.max + o } };
}

/** For one bike, end and style: the static target (whole mm) whose narrowest band over the grid (best free length) is widest. */
function chooseStatic(d: Designed, end: 'fork' | 'shock', style: Style): { staticSagMm: number; riderSagMm: number; bands: Bands[]; worst: number; failing: string[] } {
  const travel = end === 'fork' ? d.dto.forkTravelMm : d.dto.rearWheelTravelMm;
  const R = Math.round((end === 'fork' ? d.k.shareF : d.k.shareR)[style] * travel);
  let best: { staticSagMm: number; riderSagMm: number; bands: Bands[]; worst: number; failing: string[] } | undefined;
  // Static sag between a sixth and three fifths of the rider sag (common practice keeps it well under the rider sag).
  for (let S = Math.ceil(R / 6); S <= Math.floor((R * 3) / 5); S++) {
    const bands: Bands[] = [];
    const failing: string[] = [];
    let worst = Infinity;
    for (const { label, loads } of gridLoads(d.dto)) {
      const e = endDesign(d, end, loads, { staticSagMm: S, riderSagMm: R });
      const per = lengthOffsetsMm.map((o) => rateBand(shifted(e, o)) ?? none);
      const widest = Math.max(...per.map((b) => b.max / b.min));
      if (!(widest > 1)) failing.push(label);
      bands.push(per);
      worst = Math.min(worst, widest > 1 ? widest : 0);
    }
    // The lowest static target whose narrowest band is still ×1.12 wide (softer springs, as the trade fits them); else the widest.
    const better = !best || failing.length < best.failing.length || (failing.length === best.failing.length && best.worst < 1.12 && worst > best.worst);
    if (better) best = { staticSagMm: S, riderSagMm: R, bands, worst, failing };
  }
  return best!;
}

const designed = bikes.map(designFitment);
const needs = new Map<string, { label: string; bands: Bands }[]>();
const report: string[] = [];
const infeasible: string[] = [];
for (const d of designed) {
  for (const end of ['fork', 'shock'] as const) {
    const sagEnd = d.dto.sag[end === 'fork' ? 'front' : 'rear'] as unknown as Record<string, unknown>;
    for (const style of styles) {
      const c = chooseStatic(d, end, style);
      if (c.failing.length) infeasible.push(`${d.dto.model} ${d.dto.variant} ${end} ${style} R ${c.riderSagMm} S ${c.staticSagMm}: ${c.failing.length} loads, e.g. ${c.failing.slice(0, 3).join(', ')} … ${c.failing.slice(-2).join(', ')}`);
      sagEnd[style] = { static: c.staticSagMm, rider: c.riderSagMm };
      const family = d.families[end];
      const list = needs.get(family) ?? [];
      gridLoads(d.dto).forEach((l, i) => list.push({ label: `${d.dto.model} ${d.dto.variant} ${style} ${l.label}`, bands: c.bands[i]! }));
      needs.set(family, list);
      report.push(`${d.dto.model} ${d.dto.variant} ${end} ${style}: ${c.staticSagMm}/${c.riderSagMm} mm ±${end === 'fork' ? d.dto.frontStaticSagToleranceMm : d.dto.rearStaticSagToleranceMm}, narrowest band ×${c.worst.toFixed(2)}, rates ${Math.min(...c.bands.map((b) => b[1]!.min)).toFixed(1)}–${Math.max(...c.bands.map((b) => b[1]!.max)).toFixed(1)} N/mm at stock length`);
    }
  }
}
console.log(report.join('\n'));
if (infeasible.length) {
  console.log(`INFEASIBLE:\n${infeasible.join('\n')}`);
  process.exit(1);
}

interface Rung { rate: number; offset: number }
/** Greedy set cover on the family's step grid and free lengths, each band shrunk by 0.5 % so rounding cannot tip a rate out. */
function ladder(family: Family): Rung[] {
  const list = needs.get(family.id) ?? [];
  const lo = Math.min(...list.flatMap((n) => n.bands.filter((b) => b !== none).map((b) => b.min)));
  const hi = Math.max(...list.flatMap((n) => n.bands.filter((b) => b !== none).map((b) => b.max)));
  const rungs: Rung[] = [];
  for (let r = Math.ceil(lo / family.step) * family.step; r <= hi + 1e-9; r += family.step) for (const offset of lengthOffsetsMm) rungs.push({ rate: r1(r), offset });
  const covers = (rung: Rung, n: (typeof list)[number]) => {
    const b = n.bands[lengthOffsetsMm.indexOf(rung.offset as never)]!;
    return b !== none && rung.rate >= b.min * 1.005 && rung.rate <= b.max / 1.005;
  };
  let open = list.filter((n) => rungs.some((r) => covers(r, n)));
  if (open.length < list.length) {
    const lost = list.filter((n) => !open.includes(n));
    throw new Error(`${family.id}: no ${family.step} N/mm step suits ${lost.length} loads, e.g. ${lost.slice(0, 3).map((n) => n.label).join('; ')}`);
  }
  const chosen: Rung[] = [];
  while (open.length) {
    let best: Rung | undefined;
    let bestCount = -1;
    for (const rung of rungs) {
      // Stock length first when it covers as many, so most springs keep the stock spacer.
      const count = open.filter((n) => covers(rung, n)).length + (rung.offset === 0 ? 0.5 : 0);
      if (count > bestCount) { best = rung; bestCount = count; }
    }
    chosen.push(best!);
    open = open.filter((n) => !covers(best!, n));
  }
  return chosen.sort((a, b) => a.rate - b.rate || a.offset - b.offset);
}

/** Wire and coils for a rate: squared-and-ground ends, room before solid for travel and the most preload, stress at solid within the allowable. */
function geometryFor(family: Family, rate: number, freeMm: number) {
  const members = designed.filter((d) => d.families[family.end] === family.id);
  const room = Math.max(...members.map((d) => (family.end === 'fork' ? d.dto.forkTravelMm + d.dto.forkPreloadMaxMm : d.dto.shockStrokeMm + d.dto.rearPreloadMaxMm))) + 6;
  // A spring longer than stock runs that much more preload, so the room before solid is the stock length's.
  const solidMax = family.freeMm - room;
  let best: { wire: number; od: number; total: number; solid: number; stress: number; allowable: number } | undefined;
  for (let d = family.end === 'fork' ? 3.5 : 5; d <= (family.end === 'fork' ? 7.5 : 18) + 1e-9; d = r1(d + 0.1)) {
    const od = r1(family.innerMm + 2 * d);
    const D = od - d;
    const G = shearModulusFor(family.material, d)!;
    const active = (G * d ** 4) / (8 * D ** 3 * rate);
    const total = r1(active + 2);
    const solid = total * d;
    if (active < 4 || solid > solidMax || !minTensileStrength(family.material, d)) continue;
    const check = checkSolidStress({ material: family.material, wireDiameterMm: d, meanDiameterMm: D, rateNPerMm: rate, freeLengthMm: freeMm, solidLengthMm: solid })!;
    const cand = { wire: d, od, total, solid, stress: check.shearStressAtSolidMPa, allowable: check.allowableMPa };
    // Prefer a wire inside the table's sizes and stress within the allowable, then the lowest stress share.
    const score = (c: typeof cand) => (c.stress <= c.allowable ? 0 : 1) * 10 + c.stress / c.allowable;
    if (!best || score(cand) < score(best)) best = cand;
  }
  if (!best) throw new Error(`${family.id}: no wire for ${rate} N/mm`);
  return best;
}

const products: ProductInputDto[] = [];
const familyRates: Record<string, Rung[]> = {};
const overStressed: string[] = [];
for (const family of families) {
  const rates = ladder(family);
  familyRates[family.id] = rates;
  rates.forEach(({ rate, offset }, i) => {
    const freeMm = family.freeMm + offset;
    const gm = geometryFor(family, rate, freeMm);
    if (gm.stress > gm.allowable) overStressed.push(`${family.id} ${rate}: ${gm.stress.toFixed(0)} > ${gm.allowable.toFixed(0)} MPa`);
    const check = computeSpringGeometry({ wireDiameterMm: gm.wire, outsideDiameterMm: gm.od, totalCoils: gm.total, endType: 'squared-ground', material: family.material, freeLengthMm: freeMm });
    if (Math.abs(check.rateNPerMm - rate) / rate > 0.05) throw new Error(`geometry off for ${family.id} ${rate}`);
    const kgf = rate / 9.80665;
    const isFork = family.end === 'fork';
    const twin = family.id === 'SE';
    products.push({
      sku: `LL-${family.id}-${freeMm}-${String(Math.round(rate * 10)).padStart(4, '0')}`,
      name: isFork
        ? `Fork spring pair ${rate.toFixed(1)} N/mm (${kgf.toFixed(2)} kgf/mm), ${freeMm} mm`
        : twin ? `Twin-shock spring pair ${rate} N/mm (${kgf.toFixed(2)} kgf/mm), ${freeMm} mm` : `Shock spring ${rate} N/mm (${kgf.toFixed(1)} kgf/mm), ${freeMm} mm`,
      kind: 'spring',
      description: isFork
        ? `Linear fork springs, **sold as a pair**. ${family.innerMm} mm inner diameter, ${freeMm} mm free length, ${family.material} wire, ground ends.\n\n- Rate per spring: ${rate.toFixed(1)} N/mm\n- Set the preload with the spacer chart on the setup sheet.`
        : twin
          ? `Linear springs for a pair of twin shocks, **sold as a pair**. ${family.innerMm} mm inner diameter, ${freeMm} mm free length, ${family.material} wire, ground ends.\n\n- Rate per spring: ${rate} N/mm\n- Set both shocks to the same preload.`
          : `Linear coil spring for the rear shock. ${family.innerMm} mm inner diameter, ${freeMm} mm free length, ${family.material} wire, ground ends, powder-coated.\n\n- Rate: ${rate} N/mm\n- Check the preload collar thread before fitting.`,
      priceCents: isFork || twin ? 13900 + Math.round(freeMm / 10) * 50 : 11900 + Math.round(freeMm / 10) * 100,
      stockOnHand: (Math.round(rate * 7) % 9) + (i % 2 === 0 ? 2 : 0),
      binLocation: `${isFork ? 'F' : 'S'}${family.id.slice(1)}-${String(i + 1).padStart(2, '0')}`,
      active: true,
      spring: { end: family.end, rateNPerMm: rate, freeLengthMm: freeMm, innerDiameterMm: family.innerMm, outerDiameterMm: gm.od, wireDiameterMm: gm.wire, totalCoils: gm.total, endType: 'squared-ground', material: family.material },
    } as ProductInputDto);
  });
}

// Every load of the grid once more against the final ladders, and the stock springs: one step soft of the middle of what suits a 75 kg road rider.
const misses: string[] = [];
for (const d of designed) {
  for (const end of ['fork', 'shock'] as const) {
    const family = fam(d.families[end]);
    const rates = familyRates[family.id]!;
    for (const style of styles) {
      const pair = (d.dto.sag[end === 'fork' ? 'front' : 'rear'] as unknown as Record<Style, { static: number; rider: number }>)[style];
      for (const l of gridLoads(d.dto)) {
        const e = endDesign(d, end, l.loads, { staticSagMm: pair.static, riderSagMm: pair.rider });
        if (!rates.some((r) => suits(e, r.rate, r.offset))) misses.push(`${d.dto.model} ${d.dto.variant} ${end} ${style} ${l.label}`);
      }
    }
    const pair = (d.dto.sag[end === 'fork' ? 'front' : 'rear'] as unknown as Record<Style, { static: number; rider: number }>).road;
    const rider = d.dto.loadStations[0]!;
    const e = endDesign(d, end, [{ massKg: 75 + gridGearKg, positionMm: rider.positionMm }], { staticSagMm: pair.static, riderSagMm: pair.rider });
    // The middle of that rider's band (geometric mean), on the family's steps, one step soft: stock springs are often set up for a lighter rider.
    const band = rateBand(e);
    const middle = band ? Math.sqrt(band.min * band.max) : rates[0]!.rate;
    const stock = r1(Math.max(family.step, Math.round(middle / family.step) * family.step - family.step));
    if (end === 'fork') d.dto.stockForkRateNPerMm = stock;
    else d.dto.stockShockRateNPerMm = stock;
  }
  d.dto.notes = `Demo data: invented bike, figures typical of its class, from memory. Springs of family ${d.families.fork} (fork) and ${d.families.shock} (shock) fit.`;
}

const shockTravelReport = designed.map((d) => `${d.dto.model} ${d.dto.variant}: shock travel ${shockTravelAt(d.curve, d.dto.rearWheelTravelMm).toFixed(1)} of ${d.dto.shockStrokeMm} mm`);
console.log(shockTravelReport.join('\n'));
console.log(`ladders: ${Object.entries(familyRates).map(([k, v]) => `${k}: ${v.map((r) => (r.offset ? `${r.rate}(${r.offset > 0 ? '+' : ''}${r.offset})` : r.rate)).join(' ')}`).join('; ')}`);
console.log(`springs ${products.length}; over the allowable at solid: ${overStressed.length ? overStressed.join(', ') : 'none'}; grid misses: ${misses.length}`);
if (misses.length) console.log(misses.slice(0, 20).join('\n'));

const extras: ProductInputDto[] = [
  { sku: 'LL-AD-SC56-61', name: 'Shock spring adapter, 56 to 61 mm seat', kind: 'adapter', description: 'Aluminium spring seat that centres a **61 mm** inner-diameter shock spring on a 56 mm collar.', priceCents: 2400, stockOnHand: 14, binLocation: 'AD-01', active: true },
  { sku: 'LL-AD-FSPC-20', name: 'Fork preload spacer kit, 20 mm', kind: 'adapter', description: 'Two aluminium spacers and washers to set fork preload when the new springs are shorter than stock.', priceCents: 1900, stockOnHand: 22, binLocation: 'AD-02', active: true },
  { sku: 'LL-AD-BUMP-40', name: 'Bump-stop spacer, 40 mm', kind: 'adapter', description: 'Keeps a softer shock spring off coil bind on long-travel shocks.', priceCents: 1500, stockOnHand: 9, binLocation: 'AD-03', active: true },
  { sku: 'LL-TL-COMP-1', name: 'Shock spring compressor', kind: 'tool', description: 'Two-hook shock spring compressor for springs from 40 to 70 mm inner diameter.\n\nAlways compress evenly and wear eye protection.', priceCents: 8900, stockOnHand: 6, binLocation: 'TL-01', active: true },
  { sku: 'LL-TL-SAG-1', name: 'Sag measuring tool', kind: 'tool', description: 'Telescopic sag gauge reading in mm and inches; hooks on the rear axle and a fixed point above it.', priceCents: 3900, stockOnHand: 12, binLocation: 'TL-02', active: true },
  { sku: 'LL-TL-CAP-24', name: 'Fork cap socket set', kind: 'tool', description: 'Thin-wall sockets for fork caps from 24 to 50 mm.', priceCents: 4500, stockOnHand: 4, binLocation: 'TL-03', active: true },
  { sku: 'LL-AC-OIL-1', name: 'Fork oil 7.5W, 1 l', kind: 'accessory', description: 'Fork oil for a spring change: most forks take 450–650 ml per leg; see the setup sheet.', priceCents: 1800, stockOnHand: 30, binLocation: 'AC-01', active: true },
];

// Where a spring family needs a part to sit right on a bike (a seat, a spacer, a bump stop), it goes in the cart with it.
const adapterNeeds = [
  { fitment: { make: 'Haldris', model: 'Nomad 1200', variant: '' }, springFamily: 'SC', adapterSku: 'LL-AD-SC56-61', quantity: 1 },
  { fitment: { make: 'Haldris', model: 'Nomad 1200', variant: 'Low' }, springFamily: 'SC', adapterSku: 'LL-AD-SC56-61', quantity: 1 },
  { fitment: { make: 'Ostrel', model: 'Sting 450', variant: '' }, springFamily: 'SD', adapterSku: 'LL-AD-BUMP-40', quantity: 1 },
  { fitment: { make: 'Corvane', model: 'Ridgeline 800', variant: 'Rally' }, springFamily: 'FC', adapterSku: 'LL-AD-FSPC-20', quantity: 1 },
];

if (process.argv.includes('--write')) {
  if (misses.length) throw new Error('Not writing: some loads of the grid have no suiting spring.');
  writeFileSync('seeds/data/fitments.json', JSON.stringify(designed.map((d) => d.dto), null, 1) + '\n');
  writeFileSync('seeds/data/products.json', JSON.stringify({ springs: products, others: extras, adapterNeeds }, null, 1) + '\n');
  console.log('written');
}
