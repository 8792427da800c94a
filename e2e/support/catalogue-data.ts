import type { FitmentInputDto, ProductInputDto } from '../../shared/catalogue';

// Invented figures typical of a mid-size touring bike; each test overrides what it is about.
export function e2eFitment(overrides: Partial<FitmentInputDto> = {}): FitmentInputDto {
  const tag = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;
  return {
    make: 'Testwerk',
    model: `Vantor E2E ${tag}`,
    variant: '',
    yearFrom: 2018,
    yearTo: 2022,
    massInput: 'sprung',
    frontSprungMassKg: 96,
    rearSprungMassKg: 88,
    ratedLoadKg: 200,
    wheelbaseMm: 1510,
    loadStations: [
      { station: 'rider', positionMm: 750, maxLoadKg: 150 },
      { station: 'passenger', positionMm: 1040, maxLoadKg: 100 },
      { station: 'top-case', positionMm: 1640, maxLoadKg: 10 },
    ],
    rearLeverageRatio: 2.5,
    rearLeverageCurve: null,
    rearWheelTravelMm: 190,
    shockStrokeMm: 76,
    rearPreloadMinMm: 2,
    rearPreloadMaxMm: 20,
    rearAdjusterPitchMm: 1.5,
    shockSpringInnerDiameterMm: 61,
    shockSpringFreeLengthMinMm: 180,
    shockSpringFreeLengthMaxMm: 200,
    forkAngleDeg: 26,
    forkTravelMm: 200,
    forkSpringCount: 2,
    forkPreloadMinMm: 0,
    forkPreloadMaxMm: 18,
    forkAdjusterPitchMm: 1,
    forkSpringInnerDiameterMm: 28,
    forkSpringFreeLengthMinMm: 430,
    forkSpringFreeLengthMaxMm: 470,
    sag: {
      front: { unit: 'mm', road: { static: 28, rider: 48 }, adventure: { static: 30, rider: 52 }, offRoad: { static: 32, rider: 58 } },
      rear: { unit: 'mm', road: { static: 20, rider: 52 }, adventure: { static: 22, rider: 58 }, offRoad: { static: 25, rider: 64 } },
    },
    stockForkRateNPerMm: 8,
    stockForkFreeLengthMm: 450,
    stockShockRateNPerMm: 85,
    stockShockFreeLengthMm: 190,
    torques: [
      { fastener: 'Fork cap', torqueNm: 23 },
      { fastener: 'Shock lower bolt', torqueNm: 45 },
    ],
    tools: ['Spring compressor'],
    notes: 'Invented for the end-to-end tests.',
    ...overrides,
  } as FitmentInputDto;
}

/** A shock spring whose stated rate agrees with its geometry: k = G·d⁴/(8·D³·Na) gives 85.1 N/mm for these figures. */
export function e2eSpring(overrides: Partial<ProductInputDto> = {}): ProductInputDto {
  const tag = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`.toUpperCase();
  return {
    sku: `E2E-SPR-${tag}`,
    name: `E2E shock spring ${tag}`,
    kind: 'spring',
    description: 'A **test** spring for the end-to-end run.',
    priceCents: 14900,
    stockOnHand: 4,
    binLocation: 'E2E-01',
    active: true,
    spring: {
      end: 'shock',
      rateNPerMm: 85,
      freeLengthMm: 190,
      innerDiameterMm: 58,
      outerDiameterMm: 83,
      wireDiameterMm: 12.5,
      totalCoils: 9.9,
      endType: 'squared-ground',
      material: 'chrome-silicon',
    },
    ...overrides,
  } as ProductInputDto;
}

/** The smallest valid PNG (1×1, one grey pixel), so uploads pass the server's content sniffing. */
export const tinyPng = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAAAAAA6fptVAAAACklEQVR4nGNgAAAAAgABSK+kcQAAAABJRU5ErkJggg==',
  'base64',
);
