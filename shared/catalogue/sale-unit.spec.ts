import { describe, expect, it } from 'vitest';
import { perUnitWords, quantityWords, saleUnits, unitsToBuy } from './sale-unit';

describe('spring sale units', () => {
  it('a two-leg fork takes one pair, not two', () => {
    expect(unitsToBuy('fork', 2)).toBe(1);
    expect(quantityWords('fork', unitsToBuy('fork', 2))).toBe('1 pair (2 springs)');
  });
  it('a fork with a spring in one leg still buys the smallest unit sold, a pair', () => {
    expect(unitsToBuy('fork', 1)).toBe(1);
  });
  it('twin shocks take two shock springs', () => {
    expect(unitsToBuy('shock', 2)).toBe(2);
    expect(quantityWords('shock', 2)).toBe('2 springs');
  });
  it('price labels name the unit the price is for', () => {
    expect(saleUnits.fork.perUnit).toBe('per pair');
    expect(saleUnits.shock.perUnit).toBe('per spring');
  });
  it('a cart line prices a fork spring per pair, a shock spring per spring, anything else each', () => {
    expect(perUnitWords('spring', 'fork')).toBe('per pair');
    expect(perUnitWords('spring', 'shock')).toBe('per spring');
    expect(perUnitWords('tool', null)).toBe('each');
  });
});
