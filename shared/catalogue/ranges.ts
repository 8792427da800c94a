// The allowed range of every numeric catalogue field, in one decorator-free table: the request DTOs enforce
// it and the back-office forms check it before saving, so the two cannot drift apart.

export interface FieldRange {
  min: number;
  max: number;
  /** As written after the number in messages and beside the field; '' for a bare number. */
  unit: string;
  integer?: boolean;
}

/** FitmentInputDto and its nested inputs. */
export const fitmentRanges = {
  yearFrom: { min: 1950, max: 2100, unit: '', integer: true },
  yearTo: { min: 1950, max: 2100, unit: '', integer: true },
  frontSprungMassKg: { min: 20, max: 400, unit: 'kg' },
  rearSprungMassKg: { min: 20, max: 400, unit: 'kg' },
  wetMassKg: { min: 80, max: 600, unit: 'kg' },
  frontStaticSharePct: { min: 30, max: 70, unit: '%' },
  frontUnsprungMassKg: { min: 5, max: 60, unit: 'kg' },
  rearUnsprungMassKg: { min: 5, max: 60, unit: 'kg' },
  ratedLoadKg: { min: 50, max: 400, unit: 'kg' },
  wheelbaseMm: { min: 1000, max: 2000, unit: 'mm' },
  rearLeverageRatio: { min: 1, max: 5, unit: '' },
  rearWheelTravelMm: { min: 50, max: 350, unit: 'mm' },
  shockStrokeMm: { min: 20, max: 150, unit: 'mm' },
  shockCount: { min: 1, max: 2, unit: 'shocks', integer: true },
  rearPreloadMinMm: { min: 0, max: 40, unit: 'mm' },
  rearPreloadMaxMm: { min: 0, max: 40, unit: 'mm' },
  rearAdjusterPitchMm: { min: 0.1, max: 5, unit: 'mm/turn' },
  shockSpringInnerDiameterMm: { min: 10, max: 100, unit: 'mm' },
  shockSpringFreeLengthMinMm: { min: 50, max: 700, unit: 'mm' },
  shockSpringFreeLengthMaxMm: { min: 50, max: 700, unit: 'mm' },
  forkAngleDeg: { min: 0, max: 40, unit: '°' },
  forkTravelMm: { min: 50, max: 350, unit: 'mm' },
  forkSpringCount: { min: 1, max: 2, unit: 'springs', integer: true },
  forkPreloadMinMm: { min: 0, max: 40, unit: 'mm' },
  forkPreloadMaxMm: { min: 0, max: 40, unit: 'mm' },
  forkAdjusterPitchMm: { min: 0.1, max: 5, unit: 'mm/turn' },
  forkStockSpacerMm: { min: 0, max: 300, unit: 'mm' },
  forkStockPreloadMm: { min: 0, max: 40, unit: 'mm' },
  forkSpringInnerDiameterMm: { min: 10, max: 100, unit: 'mm' },
  forkSpringFreeLengthMinMm: { min: 50, max: 700, unit: 'mm' },
  forkSpringFreeLengthMaxMm: { min: 50, max: 700, unit: 'mm' },
  stockForkRateNPerMm: { min: 1, max: 300, unit: 'N/mm' },
  stockForkFreeLengthMm: { min: 50, max: 700, unit: 'mm' },
  stockShockRateNPerMm: { min: 1, max: 300, unit: 'N/mm' },
  stockShockFreeLengthMm: { min: 50, max: 700, unit: 'mm' },
  stationPositionMm: { min: 0, max: 2500, unit: 'mm' },
  stationMaxLoadKg: { min: 1, max: 250, unit: 'kg' },
  curveWheelTravelMm: { min: 0, max: 400, unit: 'mm' },
  curveRatio: { min: 1, max: 5, unit: '' },
  staticSag: { min: 0, max: 200, unit: 'mm or %' },
  riderSag: { min: 1, max: 200, unit: 'mm or %' },
  frontStaticSagToleranceMm: { min: 0.5, max: 20, unit: 'mm' },
  rearStaticSagToleranceMm: { min: 0.5, max: 20, unit: 'mm' },
  torqueNm: { min: 0.5, max: 500, unit: 'N·m' },
} as const satisfies Record<string, FieldRange>;

/** The spring details of ProductInputDto. */
export const springRanges = {
  rateNPerMm: { min: 1, max: 300, unit: 'N/mm' },
  freeLengthMm: { min: 50, max: 700, unit: 'mm' },
  wireDiameterMm: { min: 0.5, max: 25, unit: 'mm' },
  outerDiameterMm: { min: 10, max: 150, unit: 'mm' },
  totalCoils: { min: 3, max: 100, unit: 'coils' },
  innerDiameterMm: { min: 5, max: 140, unit: 'mm' },
  solidLengthMm: { min: 5, max: 700, unit: 'mm' },
} as const satisfies Record<string, FieldRange>;

/** RiderInputDto: who sits on the rider seat. */
export const riderRanges = {
  massKg: { min: 20, max: 250, unit: 'kg' },
  gearKg: { min: 0, max: 50, unit: 'kg' },
} as const satisfies Record<string, FieldRange>;

/**
 * The number with its unit as messages write it.
 * @example withUnit(40, '°') // "40 °"; withUnit(1950, '') // "1950"
 */
export function withUnit(value: number, unit: string): string {
  return unit ? `${value} ${unit}` : String(value);
}
