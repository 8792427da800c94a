import type { SpringGeometryFieldsDto, SpringGeometryPreviewDto } from '../../shared/catalogue';
import { catalogueSolidStress, computeSpringGeometry, shearModulusFor } from '../../shared/engine';
import { AppError } from '../errors';

/** A stated rate further than this from the geometry's is flagged to staff. */
export const rateMismatchPct = 5;

/**
 * Runs the engine's spring-geometry function on the form's values; a geometry the engine cannot
 * take (unknown material, wire too thick for the diameter, no active coils) is a field error.
 */
export function springGeometry(g: SpringGeometryFieldsDto, statedRateNPerMm?: number, statedSolidLengthMm?: number | null): SpringGeometryPreviewDto {
  const fields: Record<string, string> = {};
  if (shearModulusFor(g.material, g.wireDiameterMm) === undefined) fields.material = 'Choose a material from the list.';
  if (!(g.outerDiameterMm > 2 * g.wireDiameterMm * 1.5)) fields.outerDiameterMm = 'The outer diameter must be more than three wire diameters.';
  if (Object.keys(fields).length) throw AppError.validation('Some fields need attention.', fields);
  let r;
  try {
    r = computeSpringGeometry({
      wireDiameterMm: g.wireDiameterMm,
      outsideDiameterMm: g.outerDiameterMm,
      totalCoils: g.totalCoils,
      endType: g.endType,
      material: g.material,
      freeLengthMm: g.freeLengthMm,
    });
  } catch (e) {
    if (e instanceof RangeError) throw AppError.validation(e.message, { totalCoils: e.message });
    throw e;
  }
  const solid = statedSolidLengthMm ?? r.solidLengthMm;
  if (!(g.freeLengthMm > solid)) {
    throw AppError.validation('The free length must be more than the solid length.', {
      freeLengthMm: `The free length must be more than the solid length (${solid.toFixed(1)} mm).`,
    });
  }
  const deviation = statedRateNPerMm === undefined ? 0 : ((statedRateNPerMm - r.rateNPerMm) / r.rateNPerMm) * 100;
  return {
    computedRateNPerMm: r.rateNPerMm,
    computedSolidLengthMm: r.solidLengthMm,
    rateDeviationPct: deviation,
    rateMismatch: Math.abs(deviation) > rateMismatchPct,
    springIndex: r.springIndex,
    activeCoils: r.activeCoils,
    solidStress: catalogueSolidStress({ material: g.material, wireDiameterMm: g.wireDiameterMm, outerDiameterMm: g.outerDiameterMm, computedRateNPerMm: r.rateNPerMm, freeLengthMm: g.freeLengthMm, solidLengthMm: solid }),
    meanDiameterMm: r.meanDiameterMm,
    innerDiameterMm: g.outerDiameterMm - 2 * g.wireDiameterMm,
    wahlFactor: r.wahlFactor,
    travelToSolidMm: g.freeLengthMm - solid,
  };
}
