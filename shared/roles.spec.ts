import { describe, expect, it } from 'vitest';
import { mayUse } from './roles';

describe('areas by role', () => {
  it('a rider may shop but not use the back office or the warehouse', () => {
    expect(mayUse('rider', 'shop')).toBe(true);
    expect(mayUse('rider', 'staff')).toBe(false);
    expect(mayUse('rider', 'warehouse')).toBe(false);
  });
  it('an admin may use every area, staff only their own and the shop', () => {
    expect(['shop', 'account', 'staff', 'warehouse', 'admin'].every((a) => mayUse('admin', a as never))).toBe(true);
    expect(mayUse('staff', 'staff')).toBe(true);
    expect(mayUse('staff', 'warehouse')).toBe(false);
    expect(mayUse('warehouse', 'warehouse')).toBe(true);
    expect(mayUse('warehouse', 'admin')).toBe(false);
  });
  it('nobody signed out may use any area', () => {
    expect(mayUse(undefined, 'shop')).toBe(false);
  });
});
