import type { FitmentDto, LoadStationKind, SagEndDto } from '@shared/catalogue';
import { defaultStaticSagToleranceMm } from '@shared/catalogue/constants';
import { fitmentProblems, fitmentWarnings, type FitmentRuleFields } from '@shared/catalogue/fitment-rules';
import { fitmentRanges, withUnit, type FieldRange } from '@shared/catalogue/ranges';
import { stationKinds } from '../catalogue-labels';
import type { FitmentInput } from '../api/staff-catalogue';

type N = number | null;

/** A quantity field of a back-office form: its label and the range the server also enforces. */
export interface QuantitySpec extends FieldRange {
  label: string;
  /** Shown beside the field when it differs from the unit messages use. */
  displayUnit?: string;
  optional?: boolean;
  hint?: string;
  /** 'named' words a range message as the server does for springs: "Wire diameter is at most 25 mm." */
  phrasing?: 'must' | 'named';
}

// The server's ranges (one shared table), so staff see its rule before they press save.
export const quantities = {
  yearFrom: { label: 'First year', ...fitmentRanges.yearFrom },
  yearTo: { label: 'Last year', ...fitmentRanges.yearTo },
  frontSprungMassKg: { label: 'Front sprung mass', ...fitmentRanges.frontSprungMassKg },
  rearSprungMassKg: { label: 'Rear sprung mass', ...fitmentRanges.rearSprungMassKg },
  wetMassKg: { label: 'Wet mass', ...fitmentRanges.wetMassKg, hint: 'Ready to ride: fluids and a full tank.' },
  frontStaticSharePct: { label: 'Front share of wet mass', ...fitmentRanges.frontStaticSharePct },
  frontUnsprungMassKg: { label: 'Front unsprung mass', ...fitmentRanges.frontUnsprungMassKg },
  rearUnsprungMassKg: { label: 'Rear unsprung mass', ...fitmentRanges.rearUnsprungMassKg },
  ratedLoadKg: { label: 'Rated load', ...fitmentRanges.ratedLoadKg, hint: 'The most the bike may carry: riders, gear and luggage.' },
  wheelbaseMm: { label: 'Wheelbase', ...fitmentRanges.wheelbaseMm },
  rearLeverageRatio: { label: 'Leverage ratio', ...fitmentRanges.rearLeverageRatio, displayUnit: ':1', hint: 'Wheel travel over shock travel.' },
  rearWheelTravelMm: { label: 'Rear wheel travel', ...fitmentRanges.rearWheelTravelMm },
  shockStrokeMm: { label: 'Shock stroke', ...fitmentRanges.shockStrokeMm },
  shockCount: { label: 'Shocks', ...fitmentRanges.shockCount, hint: '2 on a twin-shock bike; spring rates are per shock.' },
  rearPreloadMinMm: { label: 'Rear preload minimum', ...fitmentRanges.rearPreloadMinMm },
  rearPreloadMaxMm: { label: 'Rear preload maximum', ...fitmentRanges.rearPreloadMaxMm },
  rearAdjusterPitchMm: { label: 'Rear adjuster pitch', ...fitmentRanges.rearAdjusterPitchMm },
  shockSpringInnerDiameterMm: { label: 'Shock spring inner diameter', ...fitmentRanges.shockSpringInnerDiameterMm },
  shockSpringFreeLengthMinMm: { label: 'Shock spring free length from', ...fitmentRanges.shockSpringFreeLengthMinMm },
  shockSpringFreeLengthMaxMm: { label: 'Shock spring free length to', ...fitmentRanges.shockSpringFreeLengthMaxMm },
  forkAngleDeg: { label: 'Fork angle', ...fitmentRanges.forkAngleDeg, hint: 'From vertical.' },
  forkTravelMm: { label: 'Fork travel', ...fitmentRanges.forkTravelMm },
  forkSpringCount: { label: 'Fork springs', ...fitmentRanges.forkSpringCount },
  forkPreloadMinMm: { label: 'Fork preload minimum', ...fitmentRanges.forkPreloadMinMm },
  forkPreloadMaxMm: { label: 'Fork preload maximum', ...fitmentRanges.forkPreloadMaxMm },
  forkAdjusterPitchMm: { label: 'Fork adjuster pitch', ...fitmentRanges.forkAdjusterPitchMm, optional: true, hint: 'Leave empty when the fork has no preload adjuster.' },
  forkStockPreloadMm: { label: 'Stock fork preload', ...fitmentRanges.forkStockPreloadMm, hint: 'Spring compression at full extension as delivered.' },
  forkStockSpacerMm: { label: 'Stock fork spacer', ...fitmentRanges.forkStockSpacerMm, optional: true, hint: 'Needed on forks without an adjuster, to give the spacer to cut.' },
  forkSpringInnerDiameterMm: { label: 'Fork spring inner diameter', ...fitmentRanges.forkSpringInnerDiameterMm },
  forkSpringFreeLengthMinMm: { label: 'Fork spring free length from', ...fitmentRanges.forkSpringFreeLengthMinMm },
  forkSpringFreeLengthMaxMm: { label: 'Fork spring free length to', ...fitmentRanges.forkSpringFreeLengthMaxMm },
  frontStaticSagToleranceMm: { label: 'Front static sag tolerance', ...fitmentRanges.frontStaticSagToleranceMm, hint: 'How far static sag may sit from its target, along the fork.' },
  rearStaticSagToleranceMm: { label: 'Rear static sag tolerance', ...fitmentRanges.rearStaticSagToleranceMm, hint: 'How far static sag may sit from its target, at the wheel.' },
  stockForkRateNPerMm: { label: 'Stock fork spring rate', ...fitmentRanges.stockForkRateNPerMm },
  stockForkFreeLengthMm: { label: 'Stock fork spring free length', ...fitmentRanges.stockForkFreeLengthMm },
  stockShockRateNPerMm: { label: 'Stock shock spring rate', ...fitmentRanges.stockShockRateNPerMm },
  stockShockFreeLengthMm: { label: 'Stock shock spring free length', ...fitmentRanges.stockShockFreeLengthMm },
} as const satisfies Record<string, QuantitySpec>;

export type QuantityKey = keyof typeof quantities;

export interface StationDraft {
  present: boolean;
  positionMm: N;
  maxLoadKg: N;
}
export interface SagPairDraft {
  static: N;
  rider: N;
}
export interface SagEndDraft {
  unit: 'mm' | 'pct';
  road: SagPairDraft;
  adventure: SagPairDraft;
  offRoad: SagPairDraft;
}

export type FitmentDraft = { [K in QuantityKey]: N } & {
  make: string;
  model: string;
  variant: string;
  massInput: 'sprung' | 'wet';
  stations: Record<LoadStationKind, StationDraft>;
  leverageMode: 'ratio' | 'curve';
  rearLeverageCurve: { wheelTravelMm: N; ratio: N }[];
  sag: { front: SagEndDraft; rear: SagEndDraft };
  torques: { fastener: string; torqueNm: N }[];
  tools: string[];
  notes: string;
};

const pair = (): SagPairDraft => ({ static: null, rider: null });
const sagEnd = (): SagEndDraft => ({ unit: 'mm', road: pair(), adventure: pair(), offRoad: pair() });

export function emptyFitmentDraft(): FitmentDraft {
  const numbers = Object.fromEntries(Object.keys(quantities).map((k) => [k, null])) as { [K in QuantityKey]: N };
  return {
    ...numbers,
    forkSpringCount: 2,
    shockCount: 1,
    frontStaticSagToleranceMm: defaultStaticSagToleranceMm,
    rearStaticSagToleranceMm: defaultStaticSagToleranceMm,
    make: '',
    model: '',
    variant: '',
    massInput: 'sprung',
    stations: Object.fromEntries(stationKinds.map((k) => [k, { present: k === 'rider', positionMm: null, maxLoadKg: null }])) as Record<LoadStationKind, StationDraft>,
    leverageMode: 'ratio',
    rearLeverageCurve: [
      { wheelTravelMm: 0, ratio: null },
      { wheelTravelMm: null, ratio: null },
    ],
    sag: { front: sagEnd(), rear: sagEnd() },
    torques: [],
    tools: [],
    notes: '',
  };
}

const sagFrom = (e: SagEndDto): SagEndDraft => ({
  unit: e.unit,
  road: { ...e.road },
  adventure: { ...e.adventure },
  offRoad: { ...e.offRoad },
});

export function draftFromFitment(f: FitmentDto): FitmentDraft {
  const d = emptyFitmentDraft();
  for (const k of Object.keys(quantities) as QuantityKey[]) d[k] = (f as unknown as Record<QuantityKey, N>)[k] ?? null;
  d.make = f.make;
  d.model = f.model;
  d.variant = f.variant;
  d.massInput = f.massInput;
  for (const s of f.loadStations) d.stations[s.station] = { present: true, positionMm: s.positionMm, maxLoadKg: s.maxLoadKg };
  if (f.rearLeverageCurve) {
    d.leverageMode = 'curve';
    d.rearLeverageCurve = f.rearLeverageCurve.map((p) => ({ ...p }));
  }
  d.sag = { front: sagFrom(f.sag.front), rear: sagFrom(f.sag.rear) };
  d.torques = f.torques.map((t) => ({ fastener: t.fastener, torqueNm: t.torqueNm }));
  d.tools = [...f.tools];
  d.notes = f.notes;
  return d;
}

/** The stations the bike has, in the order they are sent; a server path `loadStations.i.*` indexes this list. */
export const presentStations = (d: FitmentDraft): LoadStationKind[] => stationKinds.filter((k) => d.stations[k].present);

const massKeys = { sprung: ['frontSprungMassKg', 'rearSprungMassKg'], wet: ['wetMassKg', 'frontStaticSharePct', 'frontUnsprungMassKg', 'rearUnsprungMassKg'] } as const;

/** The request body; call after `checkFitmentDraft` found nothing, so numbers are numbers. */
export function fitmentInputFromDraft(d: FitmentDraft): FitmentInput {
  const n = (v: N) => v as number;
  const wet = d.massInput === 'wet';
  const sendMass = (k: (typeof massKeys)['sprung' | 'wet'][number]) => ((massKeys[d.massInput] as readonly string[]).includes(k) ? d[k] : null);
  return {
    make: d.make.trim(),
    model: d.model.trim(),
    variant: d.variant.trim(),
    yearFrom: n(d.yearFrom),
    yearTo: n(d.yearTo),
    massInput: d.massInput,
    frontSprungMassKg: wet ? null : sendMass('frontSprungMassKg'),
    rearSprungMassKg: wet ? null : sendMass('rearSprungMassKg'),
    wetMassKg: sendMass('wetMassKg'),
    frontStaticSharePct: sendMass('frontStaticSharePct'),
    frontUnsprungMassKg: sendMass('frontUnsprungMassKg'),
    rearUnsprungMassKg: sendMass('rearUnsprungMassKg'),
    ratedLoadKg: n(d.ratedLoadKg),
    wheelbaseMm: n(d.wheelbaseMm),
    loadStations: presentStations(d).map((station) => ({ station, positionMm: n(d.stations[station].positionMm), maxLoadKg: n(d.stations[station].maxLoadKg) })),
    rearLeverageRatio: d.leverageMode === 'ratio' ? d.rearLeverageRatio : null,
    rearLeverageCurve: d.leverageMode === 'curve' ? d.rearLeverageCurve.map((p) => ({ wheelTravelMm: n(p.wheelTravelMm), ratio: n(p.ratio) })) : null,
    rearWheelTravelMm: n(d.rearWheelTravelMm),
    shockStrokeMm: n(d.shockStrokeMm),
    shockCount: n(d.shockCount),
    rearPreloadMinMm: n(d.rearPreloadMinMm),
    rearPreloadMaxMm: n(d.rearPreloadMaxMm),
    rearAdjusterPitchMm: n(d.rearAdjusterPitchMm),
    shockSpringInnerDiameterMm: n(d.shockSpringInnerDiameterMm),
    shockSpringFreeLengthMinMm: n(d.shockSpringFreeLengthMinMm),
    shockSpringFreeLengthMaxMm: n(d.shockSpringFreeLengthMaxMm),
    forkAngleDeg: n(d.forkAngleDeg),
    forkTravelMm: n(d.forkTravelMm),
    forkSpringCount: n(d.forkSpringCount),
    forkPreloadMinMm: n(d.forkPreloadMinMm),
    forkPreloadMaxMm: n(d.forkPreloadMaxMm),
    forkAdjusterPitchMm: d.forkAdjusterPitchMm,
    forkStockSpacerMm: d.forkStockSpacerMm,
    forkStockPreloadMm: n(d.forkStockPreloadMm),
    forkSpringInnerDiameterMm: n(d.forkSpringInnerDiameterMm),
    forkSpringFreeLengthMinMm: n(d.forkSpringFreeLengthMinMm),
    forkSpringFreeLengthMaxMm: n(d.forkSpringFreeLengthMaxMm),
    sag: {
      front: { unit: d.sag.front.unit, road: sagPair(d.sag.front.road), adventure: sagPair(d.sag.front.adventure), offRoad: sagPair(d.sag.front.offRoad) },
      rear: { unit: d.sag.rear.unit, road: sagPair(d.sag.rear.road), adventure: sagPair(d.sag.rear.adventure), offRoad: sagPair(d.sag.rear.offRoad) },
    },
    frontStaticSagToleranceMm: n(d.frontStaticSagToleranceMm),
    rearStaticSagToleranceMm: n(d.rearStaticSagToleranceMm),
    stockForkRateNPerMm: n(d.stockForkRateNPerMm),
    stockForkFreeLengthMm: n(d.stockForkFreeLengthMm),
    stockShockRateNPerMm: n(d.stockShockRateNPerMm),
    stockShockFreeLengthMm: n(d.stockShockFreeLengthMm),
    torques: d.torques.map((t) => ({ fastener: t.fastener.trim(), torqueNm: n(t.torqueNm) })),
    tools: d.tools.map((t) => t.trim()).filter((t) => t !== ''),
    notes: d.notes,
  };
}

const sagPair = (p: SagPairDraft) => ({ static: p.static as number, rider: p.rider as number });

/** The draft as the shared cross-field rules read it; blanks stay null, so a rule that needs them waits. */
function ruleFieldsFromDraft(d: FitmentDraft): FitmentRuleFields {
  return {
    ...d,
    loadStations: presentStations(d).map((station) => ({ station, positionMm: d.stations[station].positionMm })),
    rearLeverageRatio: d.leverageMode === 'ratio' ? d.rearLeverageRatio : null,
    rearLeverageCurve: d.leverageMode === 'curve' ? d.rearLeverageCurve : null,
  };
}

/** The shared rule's warnings for the draft: what staff may save but should look at twice. */
export function fitmentDraftWarnings(d: FitmentDraft): Record<string, string> {
  return fitmentWarnings({ ...ruleFieldsFromDraft(d), forkAdjusterPitchMm: d.forkAdjusterPitchMm, forkStockSpacerMm: d.forkStockSpacerMm });
}

/** One number against its spec, in the server's words; '' when fine. */
export function checkQuantity(value: N, spec: QuantitySpec): string {
  if (value === null) return spec.optional ? '' : `Enter the ${spec.label.toLowerCase()}.`;
  if (!Number.isFinite(value)) return `${spec.label} is a number.`;
  if (spec.integer && !Number.isInteger(value)) return `${spec.label} is a whole number.`;
  const lead = spec.phrasing === 'named' ? `${spec.label} is` : 'Must be';
  if (value < spec.min) return `${lead} at least ${withUnit(spec.min, spec.unit)}.`;
  if (value > spec.max) return `${lead} at most ${withUnit(spec.max, spec.unit)}.`;
  return '';
}

/** Cheap checks before sending: what is missing, not a number, out of range or out of order. Keys are the server's field paths. */
export function checkFitmentDraft(d: FitmentDraft): Record<string, string> {
  const p: Record<string, string> = {};
  const put = (key: string, message: string) => {
    if (message && !p[key]) p[key] = message;
  };
  if (!d.make.trim()) put('make', 'Enter the make.');
  if (!d.model.trim()) put('model', 'Enter the model.');
  const skip = new Set<string>(d.massInput === 'wet' ? massKeys.sprung : massKeys.wet);
  if (d.leverageMode === 'curve') skip.add('rearLeverageRatio');
  for (const [key, spec] of Object.entries(quantities) as [QuantityKey, QuantitySpec][]) {
    if (!skip.has(key)) put(key, checkQuantity(d[key], spec));
  }
  presentStations(d).forEach((kind, i) => {
    put(`loadStations.${i}.positionMm`, checkQuantity(d.stations[kind].positionMm, { label: 'Position', ...fitmentRanges.stationPositionMm }));
    put(`loadStations.${i}.maxLoadKg`, checkQuantity(d.stations[kind].maxLoadKg, { label: 'Maximum load', ...fitmentRanges.stationMaxLoadKg }));
  });
  if (d.leverageMode === 'curve') {
    if (d.rearLeverageCurve.length < 2) put('rearLeverageCurve', 'A curve has at least 2 points.');
    d.rearLeverageCurve.forEach((pt, i) => {
      put(`rearLeverageCurve.${i}.wheelTravelMm`, checkQuantity(pt.wheelTravelMm, { label: 'Wheel travel', ...fitmentRanges.curveWheelTravelMm }));
      put(`rearLeverageCurve.${i}.ratio`, checkQuantity(pt.ratio, { label: 'Ratio', ...fitmentRanges.curveRatio }));
    });
  }
  for (const end of ['front', 'rear'] as const) {
    for (const style of ['road', 'adventure', 'offRoad'] as const) {
      const sp = d.sag[end][style];
      put(`sag.${end}.${style}.static`, checkQuantity(sp.static, { label: 'Static sag', ...fitmentRanges.staticSag }));
      put(`sag.${end}.${style}.rider`, checkQuantity(sp.rider, { label: 'Rider sag', ...fitmentRanges.riderSag }));
    }
  }
  d.torques.forEach((t, i) => {
    if (!t.fastener.trim()) put(`torques.${i}.fastener`, 'Name the fastener.');
    put(`torques.${i}.torqueNm`, checkQuantity(t.torqueNm, { label: 'Torque', ...fitmentRanges.torqueNm }));
  });
  // The server's own rules across fields, after the per-field ones so a field shows its first problem.
  for (const [key, message] of Object.entries(fitmentProblems(ruleFieldsFromDraft(d)))) put(key, message);
  return p;
}
