import { computed, toValue, type MaybeRefOrGetter } from 'vue';
import { catalogueSolidStress, computeSpringGeometry, type SolidStressCheck, type SpringEndType, type SpringGeometryResult } from '@shared/engine';

/** A stated rate further than this from the geometry's rate is flagged to staff (the 5 %). */
export const RATE_DISAGREEMENT_LIMIT = 0.05;

/** What staff have typed so far; any field may still be empty (null) or not a number (NaN). */
export interface SpringGeometryDraft {
  wireDiameterMm: number | null;
  outerDiameterMm: number | null;
  totalCoils: number | null;
  endType: SpringEndType | null;
  material: string | null;
  freeLengthMm?: number | null;
  rateNPerMm?: number | null;
  /** Stated solid length; the computed one stands when empty. */
  solidLengthMm?: number | null;
}

export interface SpringGeometryLive {
  result: SpringGeometryResult | null;
  /** Why there is no result yet, in words for staff; empty when there is one. */
  problem: string;
  /** (stated − computed) / computed, or null without both. */
  rateDifference: number | null;
  rateFlagged: boolean;
  /** Free length not above the solid length: the spring cannot compress at all. */
  solidAboveFree: boolean;
  /** Stress closed to solid against the wire's allowable (the product API's own check); null without a free length or table row. */
  solidStress: SolidStressCheck | null;
}

const positive = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;

/** The shared engine's spring geometry for a draft, recomputed on every keystroke. */
export function evaluateSpringDraft(d: SpringGeometryDraft): SpringGeometryLive {
  const none = (problem: string): SpringGeometryLive => ({ result: null, problem, rateDifference: null, rateFlagged: false, solidAboveFree: false, solidStress: null });
  if (!positive(d.wireDiameterMm) || !positive(d.outerDiameterMm) || !positive(d.totalCoils)) {
    return none('Enter the wire diameter, outer diameter and total coils to see the computed rate.');
  }
  if (!d.endType) return none('Choose the end type to see the computed rate.');
  if (!d.material) return none('Choose the material to see the computed rate.');
  let result: SpringGeometryResult;
  try {
    result = computeSpringGeometry({
      wireDiameterMm: d.wireDiameterMm,
      outsideDiameterMm: d.outerDiameterMm,
      totalCoils: d.totalCoils,
      endType: d.endType,
      material: d.material,
      freeLengthMm: positive(d.freeLengthMm) ? d.freeLengthMm : undefined,
    });
  } catch (e) {
    // The engine throws RangeError for geometry that cannot be a spring; anything else is a bug.
    if (e instanceof RangeError) return none(`${e.message}.`);
    throw e;
  }
  const stated = positive(d.rateNPerMm) ? d.rateNPerMm : null;
  const rateDifference = stated === null ? null : (stated - result.rateNPerMm) / result.rateNPerMm;
  return {
    result,
    problem: '',
    rateDifference,
    rateFlagged: rateDifference !== null && Math.abs(rateDifference) > RATE_DISAGREEMENT_LIMIT,
    solidAboveFree: positive(d.freeLengthMm) && d.freeLengthMm <= result.solidLengthMm,
    solidStress:
      positive(d.freeLengthMm) && d.freeLengthMm > (positive(d.solidLengthMm) ? d.solidLengthMm : result.solidLengthMm)
        ? catalogueSolidStress({
            material: d.material,
            wireDiameterMm: d.wireDiameterMm,
            outerDiameterMm: d.outerDiameterMm,
            computedRateNPerMm: result.rateNPerMm,
            freeLengthMm: d.freeLengthMm,
            solidLengthMm: positive(d.solidLengthMm) ? d.solidLengthMm : result.solidLengthMm,
          })
        : null,
  };
}

/** Live spring geometry for a reactive draft. */
export function useSpringGeometry(draft: MaybeRefOrGetter<SpringGeometryDraft>) {
  return computed(() => evaluateSpringDraft(toValue(draft)));
}
