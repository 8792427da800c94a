import { describe, expect, it } from 'vitest';
import { fitReasons } from './fit-reasons';

const bike = {
  forkSpringInnerDiameterMm: 28,
  forkSpringFreeLengthMinMm: 430,
  forkSpringFreeLengthMaxMm: 470,
  shockSpringInnerDiameterMm: 61,
  shockSpringFreeLengthMinMm: 180,
  shockSpringFreeLengthMaxMm: 200,
};

describe('why a spring fits a fitment by the rule', () => {
  it('a shock spring within half a millimetre of the bore and inside the length window passes both checks', () => {
    expect(fitReasons({ end: 'shock', innerDiameterMm: 61.5, freeLengthMm: 200 }, bike).map((r) => r.ok)).toEqual([true, true]);
  });

  it('a spring too wide or too long says which, against that end’s window', () => {
    const [diameter, length] = fitReasons({ end: 'shock', innerDiameterMm: 58, freeLengthMm: 240 }, bike);
    expect(diameter).toMatchObject({ ok: false });
    expect(diameter!.text).toMatch(/58 mm does not match the bike's 61 mm/);
    expect(length).toMatchObject({ ok: false });
    expect(length!.text).toMatch(/240 mm is outside 180–200 mm/);
  });

  it('a fork spring is measured against the fork’s window, not the shock’s', () => {
    expect(fitReasons({ end: 'fork', innerDiameterMm: 28, freeLengthMm: 460 }, bike).every((r) => r.ok)).toBe(true);
  });
});
