import { create, unitDependencies } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { SpringDetailsDto } from '@shared/catalogue/product.dto';
import { pricePer, springSpecRows } from './product-specs';

const math = create({ unitDependencies: unitDependencies! });
// An invented shock spring; only its figures matter here.
const spring = {
  end: 'shock',
  rateNPerMm: 95,
  freeLengthMm: 190,
  innerDiameterMm: 61,
  outerDiameterMm: 83,
  wireDiameterMm: 11,
  totalCoils: 7.4,
  solidLengthMm: 81.4,
} as SpringDetailsDto;

const number = (text: string) => Number(text.replace(/,/g, '').match(/-?[\d.]+/g)!.at(-1));
const row = (label: string) => springSpecRows(spring).find((r) => r.label.startsWith(label))!;

describe('product page specifications in both unit systems', () => {
  it('kgf/mm from N/mm: 1 kgf = 9.80665 N exactly (standard gravity, 3rd CGPM 1901; NIST SP 811, 2008, B.8), and mathjs agrees', () => {
    const kgf = Number(row('Rate').metric.split('·')[1]!.replace(/[^\d.]/g, ''));
    expect(kgf).toBeCloseTo(95 / 9.80665, 2);
    expect(kgf).toBeCloseTo(math.unit(95, 'N/mm').toNumber('kgf/mm'), 2);
  });

  it('lbf/in from N/mm: 1 lbf/in = 0.1751268 N/mm (4.448222 N per lbf over 25.4 mm per in; NIST SP 811, 2008, B.8), and mathjs agrees', () => {
    const lbfPerIn = number(row('Rate').imperial);
    // 95 N/mm ÷ 0.1751268 = 542.46 lbf/in; shown to 0.1.
    expect(lbfPerIn).toBeCloseTo(95 / 0.1751268, 1);
    expect(lbfPerIn).toBeCloseTo(math.unit(95, 'N/mm').toNumber('lbf/in'), 1);
    expect(lbfPerIn).toBe(542.5);
  });

  it('lengths in mm and in: 1 in = 25.4 mm exactly (international inch, 1959)', () => {
    const free = row('Free length');
    expect(free.metric).toBe('190 mm');
    expect(number(free.imperial)).toBeCloseTo(190 / 25.4, 2);
    expect(free.imperial).toBe('7.48 in');
    expect(number(row('Wire diameter').imperial)).toBeCloseTo(math.unit(11, 'mm').toNumber('in'), 2);
  });

  it('a fork spring\'s rate is said to be per spring of the pair, and its price per pair', () => {
    expect(springSpecRows({ ...spring, end: 'fork' })[0]!.label).toBe('Rate, each spring of the pair');
    expect(pricePer('spring', 'fork')).toBe('per pair');
    expect(pricePer('spring', 'shock')).toBe('per spring');
    expect(pricePer('tool', null)).toBe('');
  });
});
