import { forkSpringExample, rearSpringExample } from '../../shared/engine/examples';
import { fitmentInput, springInput } from './catalogue-factories';

/**
 * Valid bodies of the DTOs whose cross-field rules a schema-made body rarely meets, by class name; the fuzz test
 * mutates them and the agreement test needs valid bodies of every DTO. Figures are invented test values.
 */
export const requestExamples: Record<string, () => unknown[]> = {
  RearSpringRequestDto: () => [rearSpringExample()],
  ForkSpringRequestDto: () => [forkSpringExample()],
  SagCheckRequestDto: () => [
    { end: 'rear', extendedMm: 600, staticMm: 575, riderMm: { down: 526, up: 532 }, targets: { staticSagMm: 25, riderSagMm: 66 }, leverageRatio: 2, adjusterPitchMm: 1 },
    { end: 'front', extendedMm: 700, staticMm: 680, riderMm: 660, targets: { staticSagMm: 20, riderSagMm: 35 }, forkAngleDeg: 26, springCount: 2 },
  ],
  SpringGeometryRequestDto: () => [{ wireDiameterMm: 11, outsideDiameterMm: 78, totalCoils: 9, endType: 'squared-ground', material: 'chrome-silicon', freeLengthMm: 229 }],
  FitmentInputDto: () => [fitmentInput()],
  ProductInputDto: () => [springInput()],
  StockUpdateDto: () => [{ stockOnHand: 4 }, { change: -2, reason: 'breakage' }],
  ShopSettingsInputDto: () => [
    { shopName: 'Test shop', shopAddress: '1 Test Lane, Testville', currency: 'EUR', vatRateBasisPoints: 2000, shippingFlatCents: 690, freeShippingThresholdCents: 15_000, reservationMinutes: 30, exchangeWindowDays: 30, lowStockThreshold: 3 },
    { shopName: 'Test shop', shopAddress: '1 Test Lane, Testville', currency: 'EUR', vatRateBasisPoints: 0, shippingFlatCents: 0, freeShippingThresholdCents: 0, reservationMinutes: null, exchangeWindowDays: 0, lowStockThreshold: 0 },
  ],
  BikeSagCheckInputDto: () => [
    { end: 'rear', extendedMm: 600, staticMm: 575, riderMm: { down: 526, up: 532 } },
    { end: 'front', extendedMm: 700, staticMm: 680, riderMm: 660 },
  ],
};
