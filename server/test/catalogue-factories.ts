import type { FitmentInputDto, ProductInputDto } from '../../shared/catalogue';

/**
 * A plausible mid-size adventure bike with valid defaults; a test overrides what it cares about.
 * Figures are invented for tests (typical of the class, from memory).
 */
export function fitmentInput(overrides: Partial<FitmentInputDto> = {}): FitmentInputDto {
  return {
    make: 'Corvane',
    model: 'Ridgeline 800',
    variant: '',
    yearFrom: 2019,
    yearTo: 2023,
    massInput: 'sprung',
    frontSprungMassKg: 95,
    rearSprungMassKg: 90,
    ratedLoadKg: 210,
    wheelbaseMm: 1520,
    loadStations: [
      { station: 'rider', positionMm: 760, maxLoadKg: 150 },
      { station: 'passenger', positionMm: 1050, maxLoadKg: 110 },
      { station: 'tank-bag', positionMm: 480, maxLoadKg: 8 },
      { station: 'panniers', positionMm: 1350, maxLoadKg: 40 },
      { station: 'top-case', positionMm: 1650, maxLoadKg: 10 },
    ],
    rearLeverageRatio: 2.6,
    rearWheelTravelMm: 200,
    shockStrokeMm: 77,
    rearPreloadMinMm: 2,
    rearPreloadMaxMm: 22,
    rearAdjusterPitchMm: 1.5,
    shockSpringInnerDiameterMm: 61,
    shockSpringFreeLengthMinMm: 180,
    shockSpringFreeLengthMaxMm: 200,
    forkAngleDeg: 27,
    forkTravelMm: 210,
    forkSpringCount: 2,
    forkPreloadMinMm: 0,
    forkPreloadMaxMm: 20,
    forkAdjusterPitchMm: 1,
    forkSpringInnerDiameterMm: 28,
    forkSpringFreeLengthMinMm: 440,
    forkSpringFreeLengthMaxMm: 480,
    sag: {
      front: { unit: 'mm', road: { static: 30, rider: 50 }, adventure: { static: 30, rider: 55 }, offRoad: { static: 35, rider: 60 } },
      rear: { unit: 'mm', road: { static: 20, rider: 55 }, adventure: { static: 22, rider: 60 }, offRoad: { static: 25, rider: 66 } },
    },
    stockForkRateNPerMm: 8,
    stockForkFreeLengthMm: 460,
    stockShockRateNPerMm: 85,
    stockShockFreeLengthMm: 190,
    torques: [
      { fastener: 'Fork cap', torqueNm: 23 },
      { fastener: 'Shock lower bolt', torqueNm: 45 },
    ],
    tools: ['Spring compressor', 'Sag tool'],
    notes: 'Check the preload collar lock ring after the first ride.',
    ...overrides,
  } as FitmentInputDto;
}

let skuSeq = 0;

/** A shock or fork spring product whose geometry agrees with its stated rate. */
export function springInput(overrides: Partial<ProductInputDto> = {}, spring: Partial<NonNullable<ProductInputDto['spring']>> = {}): ProductInputDto {
  skuSeq += 1;
  return {
    sku: `TEST-SPR-${skuSeq}`,
    name: 'Test shock spring',
    kind: 'spring',
    description: 'A **test** spring.',
    priceCents: 14900,
    stockOnHand: 5,
    binLocation: 'A-01',
    active: true,
    spring: {
      end: 'shock',
      rateNPerMm: 85,
      freeLengthMm: 190,
      innerDiameterMm: 61,
      outerDiameterMm: 85,
      wireDiameterMm: 12,
      totalCoils: 8,
      endType: 'squared-ground',
      material: 'chrome-silicon',
      ...spring,
    },
    ...overrides,
  } as ProductInputDto;
}

export function productInput(overrides: Partial<ProductInputDto> = {}): ProductInputDto {
  skuSeq += 1;
  return {
    sku: `TEST-ITEM-${skuSeq}`,
    name: 'Test adapter',
    kind: 'adapter',
    description: '',
    priceCents: 2900,
    stockOnHand: 3,
    binLocation: 'B-02',
    active: true,
    ...overrides,
  } as ProductInputDto;
}
