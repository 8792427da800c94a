import { describe, expect, it } from 'vitest';
import { evaluateSpringDraft, type SpringGeometryDraft } from './useSpringGeometry';

// Shigley's Mechanical Engineering Design, 10th ed., Problem 10-3 (k ≈ 1.314 N/mm, Ls = 35 mm).
const shigley: SpringGeometryDraft = { wireDiameterMm: 2.5, outerDiameterMm: 31, totalCoils: 14, endType: 'plain-ground', material: 'music-wire', freeLengthMm: 60 };

describe('a spring draft against its geometry', () => {
  it('gives the handbook rate and solid length for the textbook spring', () => {
    const live = evaluateSpringDraft(shigley);
    expect(live.result?.rateNPerMm).toBeCloseTo(1.314, 2);
    expect(live.result?.solidLengthMm).toBeCloseTo(35, 6);
    expect(live.rateDifference).toBeNull();
  });

  it('flags a stated rate just over 5 % away and not one just under', () => {
    const k = evaluateSpringDraft(shigley).result!.rateNPerMm;
    expect(evaluateSpringDraft({ ...shigley, rateNPerMm: k * 1.051 }).rateFlagged).toBe(true);
    expect(evaluateSpringDraft({ ...shigley, rateNPerMm: k * 0.949 }).rateFlagged).toBe(true);
    expect(evaluateSpringDraft({ ...shigley, rateNPerMm: k * 1.049 }).rateFlagged).toBe(false);
  });

  it('treats half-typed or unreadable numbers as not yet given', () => {
    expect(evaluateSpringDraft({ ...shigley, wireDiameterMm: Number.NaN }).result).toBeNull();
    expect(evaluateSpringDraft({ ...shigley, totalCoils: null }).problem).toContain('total coils');
  });

  it('warns when the free length is not above the solid length', () => {
    expect(evaluateSpringDraft({ ...shigley, freeLengthMm: 34 }).solidAboveFree).toBe(true);
  });
});
