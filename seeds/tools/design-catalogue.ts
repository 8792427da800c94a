/**
 * One-off design aid for the demo catalogue: writes seeds/data/fitments.json and seeds/data/products.json.
 * Bikes, makes and shop are invented. Their figures are typical of each class of motorcycle, from memory
 * (no manufacturer's sheet was used); spring ladders are chosen with the engine so that every demo bike has
 * an `ok` fork and shock spring for riders of 60–110 kg with 8 kg of gear in every riding style, and each
 * spring's wire and coils are solved so the engine's geometry gives its stated rate.
 * Run: npx tsx --tsconfig tsconfig.server.json seeds/tools/design-catalogue.ts
 */
import { writeFileSync } from 'node:fs';
import { computeForkSpring, computeRearSpring, computeSpringGeometry, shearModulusFor } from '../../shared/engine';
import type { FitmentInputDto, ProductInputDto } from '../../shared/catalogue';

type Sag = FitmentInputDto['sag']['front'];
interface Family { id: string; end: 'fork' | 'shock'; innerMm: number; freeMm: number; step: number }
const families: Family[] = [
  { id: 'FA', end: 'fork', innerMm: 27.5, freeMm: 300, step: 0.5 },
  { id: 'FB', end: 'fork', innerMm: 27.5, freeMm: 380, step: 0.5 },
  { id: 'FC', end: 'fork', innerMm: 29, freeMm: 460, step: 0.5 },
  { id: 'FD', end: 'fork', innerMm: 29, freeMm: 520, step: 0.5 },
  { id: 'SA', end: 'shock', innerMm: 56, freeMm: 170, step: 5 },
  { id: 'SB', end: 'shock', innerMm: 61, freeMm: 200, step: 5 },
  { id: 'SC', end: 'shock', innerMm: 61, freeMm: 220, step: 5 },
  { id: 'SD', end: 'shock', innerMm: 56, freeMm: 250, step: 5 },
];
const fam = (id: string) => families.find((f) => f.id === id)!;

const mm = (rs: number, rr: number, as: number, ar: number, os: number, or: number): Sag => ({
  unit: 'mm', road: { static: rs, rider: rr }, adventure: { static: as, rider: ar }, offRoad: { static: os, rider: or },
});
const pct = (rs: number, rr: number, as: number, ar: number, os: number, or: number): Sag => ({ ...mm(rs, rr, as, ar, os, or), unit: 'pct' });

interface Klass {
  wheelbase: number; wet: number; frontShare: number; unsprungF: number; unsprungR: number; rated: number;
  rider: number; passenger?: number; tank?: number; panniers?: number; topCase?: number;
  lev: FitmentInputDto['rearLeverageRatio'] | NonNullable<FitmentInputDto['rearLeverageCurve']>; wheelTravel: number; stroke: number;
  rearPre: [number, number]; pitch: number; forkAngle: number; forkTravel: number; forkPre: [number, number]; forkPitch: number | null;
  fork: string; shock: string; sagF: Sag; sagR: Sag; torques: [string, number][];
}
const road: Klass = {
  wheelbase: 1430, wet: 192, frontShare: 50, unsprungF: 16, unsprungR: 20, rated: 190, rider: 690, passenger: 960, tank: 450, panniers: 1250, topCase: 1500,
  lev: 2.35, wheelTravel: 130, stroke: 55, rearPre: [2, 16], pitch: 1.5, forkAngle: 25, forkTravel: 125, forkPre: [0, 15], forkPitch: 1,
  fork: 'FA', shock: 'SA', sagF: mm(22, 32, 24, 35, 26, 38), sagR: mm(8, 30, 10, 33, 12, 36),
  torques: [['Fork cap', 23], ['Top clamp pinch bolt', 20], ['Bottom clamp pinch bolt', 18], ['Shock upper bolt', 44], ['Shock lower bolt', 44]],
};
const sportTour: Klass = {
  ...road, wheelbase: 1480, wet: 235, frontShare: 50, unsprungF: 18, unsprungR: 24, rated: 200, rider: 720, passenger: 1000, panniers: 1320, topCase: 1560,
  lev: 2.2, wheelTravel: 135, stroke: 62, forkAngle: 24.5, forkTravel: 130, fork: 'FB', shock: 'SB', sagF: mm(25, 35, 27, 38, 28, 40), sagR: mm(8, 32, 10, 35, 12, 38),
};
const adv: Klass = {
  wheelbase: 1540, wet: 228, frontShare: 49, unsprungF: 19, unsprungR: 25, rated: 215, rider: 760, passenger: 1050, tank: 480, panniers: 1360, topCase: 1650,
  lev: 2.75, wheelTravel: 210, stroke: 76, rearPre: [2, 24], pitch: 1.5, forkAngle: 27, forkTravel: 210, forkPre: [0, 20], forkPitch: 1,
  fork: 'FC', shock: 'SB', sagF: pct(15, 25, 16, 27, 18, 30), sagR: pct(8, 27, 9, 30, 10, 32),
  torques: [['Fork cap', 30], ['Top clamp pinch bolt', 17], ['Bottom clamp pinch bolt', 15], ['Shock upper bolt', 50], ['Shock lower bolt', 50], ['Front axle nut', 70]],
};
const bigAdv: Klass = {
  ...adv, wheelbase: 1580, wet: 262, frontShare: 48, unsprungF: 21, unsprungR: 28, rated: 225, rider: 790, passenger: 1080, panniers: 1400, topCase: 1700,
  lev: [{ wheelTravelMm: 0, ratio: 2.9 }, { wheelTravelMm: 100, ratio: 2.7 }, { wheelTravelMm: 220, ratio: 2.5 }], wheelTravel: 220, stroke: 82,
  fork: 'FC', shock: 'SC', forkTravel: 210,
};
const offRoad: Klass = {
  wheelbase: 1480, wet: 145, frontShare: 48, unsprungF: 14, unsprungR: 17, rated: 150, rider: 720, passenger: 980, tank: 430, panniers: 1300,
  lev: [{ wheelTravelMm: 0, ratio: 3.3 }, { wheelTravelMm: 150, ratio: 3.0 }, { wheelTravelMm: 290, ratio: 2.6 }], wheelTravel: 290, stroke: 100,
  rearPre: [2, 20], pitch: 1.5, forkAngle: 27, forkTravel: 280, forkPre: [0, 12], forkPitch: null,
  fork: 'FD', shock: 'SD', sagF: pct(12, 24, 13, 26, 14, 28), sagR: pct(10, 30, 10, 32, 11, 34),
  torques: [['Fork cap', 30], ['Top clamp pinch bolt', 17], ['Bottom clamp pinch bolt', 12], ['Shock upper bolt', 48], ['Linkage bolt', 60]],
};
const dualSport: Klass = {
  ...offRoad, wet: 168, wheelbase: 1500, rated: 170, rider: 740, lev: 3.0, wheelTravel: 240, stroke: 82, forkTravel: 240, fork: 'FD', shock: 'SD',
  sagF: pct(12, 22, 13, 24, 14, 27), sagR: pct(9, 28, 10, 30, 11, 33), forkPitch: 1,
};
const tourer: Klass = {
  ...sportTour, wheelbase: 1620, wet: 330, frontShare: 47, unsprungF: 24, unsprungR: 32, rated: 230, rider: 800, passenger: 1120, panniers: 1450, topCase: 1750,
  lev: 1.9, wheelTravel: 125, stroke: 68, rearPre: [2, 22], forkAngle: 27, forkTravel: 130, fork: 'FB', shock: 'SC', sagF: mm(26, 38, 28, 40, 30, 42), sagR: mm(8, 30, 10, 33, 12, 36),
};

const bikes: { make: string; model: string; variant?: string; years: [number, number]; k: Klass; mass: 'wet' | 'sprung'; tweak?: Partial<Klass> }[] = [
  { make: 'Corvane', model: 'Strada 650', years: [2017, 2020], k: road, mass: 'wet' },
  { make: 'Corvane', model: 'Strada 650', years: [2021, 2025], k: road, mass: 'wet', tweak: { wet: 196, forkPitch: null } },
  { make: 'Corvane', model: 'Ridgeline 800', years: [2019, 2022], k: adv, mass: 'sprung' },
  { make: 'Corvane', model: 'Ridgeline 800', variant: 'Rally', years: [2023, 2025], k: adv, mass: 'sprung', tweak: { wheelTravel: 230, stroke: 82, forkTravel: 230, wet: 232 } },
  { make: 'Haldris', model: 'Tempest 1000', years: [2016, 2021], k: sportTour, mass: 'wet' },
  { make: 'Haldris', model: 'Nomad 1200', years: [2018, 2023], k: bigAdv, mass: 'wet' },
  { make: 'Haldris', model: 'Nomad 1200', variant: 'Low', years: [2020, 2023], k: bigAdv, mass: 'wet', tweak: { wheelTravel: 190, forkTravel: 190, stroke: 72 } },
  { make: 'Haldris', model: 'Kite 390', years: [2020, 2025], k: road, mass: 'sprung', tweak: { wet: 168, wheelbase: 1360, rated: 170, lev: 2.5 } },
  { make: 'Brenmoor', model: 'Scrambler 900', years: [2016, 2022], k: road, mass: 'wet', tweak: { wet: 215, wheelbase: 1470, wheelTravel: 150, stroke: 62, forkTravel: 150, lev: 2.4, fork: 'FB', shock: 'SA' } },
  { make: 'Brenmoor', model: 'Classic 500', years: [2012, 2019], k: road, mass: 'wet', tweak: { wet: 198, wheelbase: 1440, lev: 1.6, wheelTravel: 88, stroke: 55, forkTravel: 130, forkPitch: null } },
  { make: 'Brenmoor', model: 'Classic 500', years: [2020, 2025], k: road, mass: 'wet', tweak: { wet: 196, wheelbase: 1440, lev: 1.6, wheelTravel: 88, stroke: 55, forkTravel: 130 } },
  { make: 'Ostrel', model: 'Apex 690', years: [2019, 2024], k: dualSport, mass: 'sprung' },
  { make: 'Ostrel', model: 'Terra 890', years: [2021, 2025], k: adv, mass: 'wet', tweak: { wet: 216, lev: 2.9, forkAngle: 26.5 } },
  { make: 'Ostrel', model: 'Sting 450', years: [2020, 2025], k: offRoad, mass: 'sprung' },
  { make: 'Vantor', model: 'GT 1300', years: [2014, 2020], k: tourer, mass: 'wet' },
  { make: 'Vantor', model: 'GT 1300', years: [2021, 2025], k: tourer, mass: 'wet', tweak: { wet: 338 } },
  { make: 'Vantor', model: 'Street 750', years: [2018, 2025], k: road, mass: 'wet', tweak: { wet: 205, lev: 2.2, stroke: 59 } },
  { make: 'Kestrune', model: 'Dune 350', years: [2015, 2025], k: dualSport, mass: 'sprung', tweak: { wet: 152, rated: 160 } },
  { make: 'Kestrune', model: 'Meridian 700', years: [2019, 2025], k: adv, mass: 'wet', tweak: { wet: 210, fork: 'FC', shock: 'SB', lev: 2.6 } },
  { make: 'Kestrune', model: 'Meridian 700', variant: 'Tour', years: [2021, 2025], k: adv, mass: 'wet', tweak: { wet: 224, panniers: 1380 } },
];

const r1 = (n: number) => Math.round(n * 10) / 10;
function fitmentOf(b: (typeof bikes)[number]): FitmentInputDto & { springFamilies: { fork: string; shock: string } } {
  const k = { ...b.k, ...b.tweak };
  const ff = fam(k.fork);
  const sf = fam(k.shock);
  const sprungF = r1((k.wet * k.frontShare) / 100 - k.unsprungF);
  const sprungR = r1((k.wet * (100 - k.frontShare)) / 100 - k.unsprungR);
  const stations: FitmentInputDto['loadStations'] = [{ station: 'rider', positionMm: k.rider, maxLoadKg: 150 }];
  if (k.passenger) stations.push({ station: 'passenger', positionMm: k.passenger, maxLoadKg: 110 });
  if (k.tank) stations.push({ station: 'tank-bag', positionMm: k.tank, maxLoadKg: 8 });
  if (k.panniers) stations.push({ station: 'panniers', positionMm: k.panniers, maxLoadKg: k.rated > 200 ? 50 : 30 });
  if (k.topCase) stations.push({ station: 'top-case', positionMm: k.topCase, maxLoadKg: 10 });
  const curve = Array.isArray(k.lev) ? k.lev : null;
  return {
    make: b.make, model: b.model, variant: b.variant ?? '', yearFrom: b.years[0], yearTo: b.years[1], massInput: b.mass,
    ...(b.mass === 'wet'
      ? { wetMassKg: k.wet, frontStaticSharePct: k.frontShare, frontUnsprungMassKg: k.unsprungF, rearUnsprungMassKg: k.unsprungR }
      : { frontSprungMassKg: sprungF, rearSprungMassKg: sprungR }),
    ratedLoadKg: k.rated, wheelbaseMm: k.wheelbase, loadStations: stations,
    ...(curve ? { rearLeverageCurve: curve } : { rearLeverageRatio: k.lev as number }),
    rearWheelTravelMm: k.wheelTravel, shockStrokeMm: k.stroke, rearPreloadMinMm: k.rearPre[0], rearPreloadMaxMm: k.rearPre[1], rearAdjusterPitchMm: k.pitch,
    shockSpringInnerDiameterMm: sf.innerMm, shockSpringFreeLengthMinMm: sf.freeMm - 10, shockSpringFreeLengthMaxMm: sf.freeMm + 10,
    forkAngleDeg: k.forkAngle, forkTravelMm: k.forkTravel, forkSpringCount: 2, forkPreloadMinMm: k.forkPre[0], forkPreloadMaxMm: k.forkPre[1], forkAdjusterPitchMm: k.forkPitch,
    forkSpringInnerDiameterMm: ff.innerMm, forkSpringFreeLengthMinMm: ff.freeMm - 10, forkSpringFreeLengthMaxMm: ff.freeMm + 10,
    sag: { front: k.sagF, rear: k.sagR },
    stockForkRateNPerMm: 0, stockForkFreeLengthMm: ff.freeMm, stockShockRateNPerMm: 0, stockShockFreeLengthMm: sf.freeMm,
    torques: k.torques.map(([fastener, torqueNm]) => ({ fastener, torqueNm })),
    tools: ['Spring compressor', 'Sag measuring tool', 'Fork cap socket', 'Torque wrench'],
    notes: '',
    springFamilies: { fork: k.fork, shock: k.shock },
  } as FitmentInputDto & { springFamilies: { fork: string; shock: string } };
}

const fitments = bikes.map(fitmentOf);
const styles = ['road', 'adventure', 'offRoad'] as const;
const targetsOf = (s: Sag, style: (typeof styles)[number], travel: number) => {
  const f = (v: number) => (s.unit === 'pct' ? (v / 100) * travel : v);
  return { staticSagMm: f(s[style].static), riderSagMm: f(s[style].rider) };
};
const riders = Array.from({ length: 51 }, (_, i) => 60 + i);

function engineRun(f: (typeof fitments)[number], end: 'fork' | 'shock', riderKg: number, style: (typeof styles)[number], springs: { id: string; rateNPerMm: number; freeLengthMm: number; solidLengthMm?: number }[]) {
  const frontSprung = f.massInput === 'wet' ? (f.wetMassKg! * f.frontStaticSharePct!) / 100 - f.frontUnsprungMassKg! : f.frontSprungMassKg!;
  const rearSprung = f.massInput === 'wet' ? (f.wetMassKg! * (100 - f.frontStaticSharePct!)) / 100 - f.rearUnsprungMassKg! : f.rearSprungMassKg!;
  const loads = [{ massKg: riderKg + 8, positionMm: f.loadStations[0]!.positionMm }];
  if (end === 'fork') {
    return computeForkSpring({ wheelbaseMm: f.wheelbaseMm, sprungMassKg: frontSprung, loads, forkAngleDeg: f.forkAngleDeg, springCount: 2, forkTravelMm: f.forkTravelMm,
      targets: targetsOf(f.sag.front, style, f.forkTravelMm), preloadRangeMm: { min: f.forkPreloadMinMm, max: f.forkPreloadMaxMm }, springs });
  }
  return computeRearSpring({ wheelbaseMm: f.wheelbaseMm, sprungMassKg: rearSprung, loads, leverageRatio: f.rearLeverageCurve ?? f.rearLeverageRatio!, wheelTravelMm: f.rearWheelTravelMm,
    shockStrokeMm: f.shockStrokeMm, targets: targetsOf(f.sag.rear, style, f.rearWheelTravelMm), preloadRangeMm: { min: f.rearPreloadMinMm, max: f.rearPreloadMaxMm }, adjusterPitchMm: f.rearAdjusterPitchMm, springs });
}

/** The rates on the family's step grid that are ok for some rider on some bike of the family (geometry ignored). */
function ladder(family: Family): number[] {
  const members = fitments.filter((f) => f.springFamilies[family.end] === family.id);
  const grid = Array.from({ length: Math.round(300 / family.step) }, (_, i) => r1((i + 1) * family.step)).filter((r) => r <= (family.end === 'fork' ? 25 : 250));
  const candidates = grid.map((r) => ({ id: String(r), rateNPerMm: r, freeLengthMm: family.freeMm }));
  // Interval stabbing: each (bike, rider, style) needs one ok rate; pick greedily from the stiff end of each need.
  const needs: number[][] = [];
  for (const f of members) for (const st of styles) for (const rk of riders) {
    const ok = engineRun(f, family.end, rk, st, candidates).candidates.filter((c) => c.verdict === 'ok').map((c) => c.rateNPerMm).sort((a, b) => a - b);
    if (!ok.length) throw new Error(`${f.make} ${f.model} ${family.end}: no ok rate for ${rk} kg ${st}`);
    needs.push(ok);
  }
  needs.sort((a, b) => a[a.length - 1]! - b[b.length - 1]!);
  const chosen: number[] = [];
  for (const n of needs) if (!n.some((r) => chosen.includes(r))) chosen.push(n[Math.floor((n.length - 1) * 0.6)]!);
  return chosen.sort((a, b) => a - b);
}

const materialOf = (end: 'fork' | 'shock') => (end === 'fork' ? 'chrome-silicon' : 'chrome-vanadium');
/** Wire and coils for a rate: the thickest standard wire that leaves room before coil bind on every bike of the family. */
function geometryFor(family: Family, rate: number) {
  const members = fitments.filter((f) => f.springFamilies[family.end] === family.id);
  const travel = Math.max(...members.map((f) => (family.end === 'fork' ? f.forkTravelMm + f.forkPreloadMaxMm : f.shockStrokeMm + f.rearPreloadMaxMm)));
  const solidMax = family.freeMm - travel - 6;
  const wires = family.end === 'fork' ? [3.8, 4.0, 4.2, 4.5, 4.8, 5.0, 5.3, 5.5] : [8.5, 9, 9.5, 10, 10.5, 11, 11.5, 12, 12.5, 13];
  let best: { wire: number; od: number; total: number; solid: number } | undefined;
  for (const d of wires) {
    const od = family.innerMm + 2 * d;
    const D = od - d;
    const G = shearModulusFor(materialOf(family.end), d)!;
    const active = (G * d ** 4) / (8 * D ** 3 * rate);
    const total = Math.round((active + 2) * 10) / 10;
    const solid = total * d;
    if (active < (family.end === 'fork' ? 8 : 4) || solid > solidMax) continue;
    if (!best || d > best.wire) best = { wire: d, od, total, solid };
  }
  if (!best) throw new Error(`${family.id}: no wire for ${rate} N/mm`);
  return best;
}

const products: (ProductInputDto & { fitsFamily?: string })[] = [];
const familyRates: Record<string, number[]> = {};
for (const family of families) {
  const rates = ladder(family);
  // Fill the gaps so the ladder reads as the regular steps a shop stocks.
  const lo = rates[0]!;
  const hi = rates[rates.length - 1]!;
  const stepUp = family.end === 'fork' ? 0.5 : 5;
  const full: number[] = [];
  const spacing = family.end === 'fork' ? 1 : 10;
  for (let r = lo; r <= hi + 1e-9; r = r1(r + spacing)) full.push(r1(r));
  for (const r of rates) if (!full.includes(r)) full.push(r);
  full.sort((a, b) => a - b);
  // At least six rates a family, added a step either side where the wire and coils still work.
  const buildable = (r: number) => { try { geometryFor(family, r); return r > 0; } catch { return false; } };
  for (let up = true, tries = 0; full.length < 6 && tries < 12; up = !up, tries++) {
    const next = up ? r1(full[full.length - 1]! + spacing) : r1(full[0]! - spacing);
    if (buildable(next)) (up ? full.push(next) : full.unshift(next));
  }
  familyRates[family.id] = full;
  void stepUp;
  for (const rate of full) {
    const g = geometryFor(family, rate);
    const check = computeSpringGeometry({ wireDiameterMm: g.wire, outsideDiameterMm: g.od, totalCoils: g.total, endType: 'squared-ground', material: materialOf(family.end), freeLengthMm: family.freeMm });
    const kgf = rate / 9.80665;
    const isFork = family.end === 'fork';
    products.push({
      sku: `LL-${family.id}-${String(Math.round(rate * 10)).padStart(4, '0')}`,
      name: isFork ? `Fork spring pair ${rate.toFixed(1)} N/mm (${kgf.toFixed(2)} kgf/mm), ${family.freeMm} mm` : `Shock spring ${rate} N/mm (${kgf.toFixed(1)} kgf/mm), ${family.freeMm} mm`,
      kind: 'spring',
      description: isFork
        ? `Linear fork springs, **sold as a pair**. ${family.innerMm} mm inner diameter, ${family.freeMm} mm free length, ${materialOf(family.end)} wire, ground ends.\n\n- Rate per spring: ${rate.toFixed(1)} N/mm\n- Set the preload with the spacer chart on the setup sheet.`
        : `Linear coil spring for the rear shock. ${family.innerMm} mm inner diameter, ${family.freeMm} mm free length, ${materialOf(family.end)} wire, ground ends, powder-coated.\n\n- Rate: ${rate} N/mm\n- Check the preload collar thread before fitting.`,
      priceCents: isFork ? 13900 + Math.round(family.freeMm / 10) * 50 : 11900 + Math.round(family.freeMm / 10) * 100,
      stockOnHand: (Math.round(rate * 7) % 9) + (rate % 2 === 0 ? 2 : 0),
      binLocation: `${isFork ? 'F' : 'S'}${family.id.slice(1)}-${String(full.indexOf(rate) + 1).padStart(2, '0')}`,
      active: true,
      spring: { end: family.end, rateNPerMm: rate, freeLengthMm: family.freeMm, innerDiameterMm: family.innerMm, outerDiameterMm: g.od, wireDiameterMm: g.wire, totalCoils: g.total, endType: 'squared-ground', material: materialOf(family.end) },
    });
    if (Math.abs(check.rateNPerMm - rate) / rate > 0.05) throw new Error(`geometry off for ${family.id} ${rate}`);
  }
}

// Every (bike, rider, style) with the final springs, coil bind included.
for (const f of fitments) {
  for (const end of ['fork', 'shock'] as const) {
    const family = fam(f.springFamilies[end]);
    const springs = products.filter((p) => p.sku.startsWith(`LL-${family.id}-`)).map((p) => ({ id: p.sku, rateNPerMm: p.spring!.rateNPerMm, freeLengthMm: p.spring!.freeLengthMm, solidLengthMm: p.spring!.totalCoils * p.spring!.wireDiameterMm }));
    for (const st of styles) for (const rk of riders) {
      if (!engineRun(f, end, rk, st, springs).candidates.some((c) => c.verdict === 'ok')) throw new Error(`${f.make} ${f.model} ${end} ${rk} ${st}: nothing ok`);
    }
        // Stock springs are often a step soft for heavier riders: one step below the best ok spring for a 72 kg rider.
    const best = engineRun(f, end, 72, 'road', springs).candidates[0]!.rateNPerMm;
    if (end === 'fork') f.stockForkRateNPerMm = r1(best - 0.5);
    else f.stockShockRateNPerMm = best - 5;
  }
  f.notes = `Demo data: invented bike, figures typical of its class, from memory. Springs of family ${f.springFamilies.fork} (fork) and ${f.springFamilies.shock} (shock) fit.`;
}

const extras: ProductInputDto[] = [
  { sku: 'LL-AD-SC56-61', name: 'Shock spring adapter, 56 to 61 mm seat', kind: 'adapter', description: 'Aluminium spring seat that centres a **61 mm** inner-diameter shock spring on a 56 mm collar.', priceCents: 2400, stockOnHand: 14, binLocation: 'AD-01', active: true },
  { sku: 'LL-AD-FSPC-20', name: 'Fork preload spacer kit, 20 mm', kind: 'adapter', description: 'Two aluminium spacers and washers to set fork preload when the new springs are shorter than stock.', priceCents: 1900, stockOnHand: 22, binLocation: 'AD-02', active: true },
  { sku: 'LL-AD-BUMP-40', name: 'Bump-stop spacer, 40 mm', kind: 'adapter', description: 'Keeps a softer shock spring off coil bind on long-travel shocks.', priceCents: 1500, stockOnHand: 9, binLocation: 'AD-03', active: true },
  { sku: 'LL-TL-COMP-1', name: 'Shock spring compressor', kind: 'tool', description: 'Two-hook shock spring compressor for springs from 50 to 70 mm inner diameter.\n\nAlways compress evenly and wear eye protection.', priceCents: 8900, stockOnHand: 6, binLocation: 'TL-01', active: true },
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

writeFileSync('seeds/data/fitments.json', JSON.stringify(fitments.map(({ springFamilies: _s, ...f }) => f), null, 1) + '\n');
writeFileSync('seeds/data/products.json', JSON.stringify({ springs: products, others: extras, adapterNeeds }, null, 1) + '\n');
console.log(`fitments ${fitments.length}, springs ${products.length} (${Object.entries(familyRates).map(([k, v]) => `${k}: ${v.join(' ')}`).join('; ')}), others ${extras.length}`);
