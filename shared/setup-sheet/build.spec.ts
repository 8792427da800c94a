import { describe, expect, it } from 'vitest';
import { buildSetupSheet, rateText, torqueText, type EndFigures } from './build';

// Invented figures for one fork end; only the wording and the conversions matter here.
const fork: EndFigures = {
  end: 'fork', productId: 'p1', sku: 'LL-F-1', name: 'Fork spring pair 9.5 N/mm', springCount: 2, rateNPerMm: 9.5, freeLengthMm: 450,
  preloadMm: 12.5, adjusterTurns: null, spacerLengthMm: 85, installedLengthMm: 437.5, staticSagMm: 29.6, riderSagMm: 50, toleranceMm: 3,
  targets: { staticSagMm: 30, riderSagMm: 50 }, unitPriceCents: 15_750, currency: 'EUR', adapters: [],
};
const sheet = buildSetupSheet({ source: 'plan', orderNumber: null, bikeLabel: 'Test bike', ridingStyle: 'road', loads: [{ station: 'rider', massKg: 103 }], ends: [fork], bike: { torques: [{ fastener: 'Fork cap', torqueNm: 25 }], tools: [], notes: '' } });
const row = (key: string) => sheet.ends[0]!.rows.find((r) => r.key === key)?.value;

describe('setup sheet wording', () => {
  it('torques in N·m and ft·lbf: 1 ft·lbf = 1.3558179483 N·m (NIST SP 811, 2008, B.8), so 25 N·m is 18.4 ft·lbf', () => {
    expect(torqueText(25)).toBe('25 N·m (18.4 ft·lbf)');
    expect(sheet.torques[0]!.torqueFtLbf).toBeCloseTo(25 / 1.3558179483, 9);
  });
  it('a rate per spring in N/mm, kgf/mm (1 kgf = 9.80665 N exactly) and lbf/in (1 lbf/in = 0.1751268 N/mm, NIST SP 811 B.8)', () => {
    // 9.5 N/mm = 0.9687 kgf/mm = 54.25 lbf/in.
    expect(rateText(9.5)).toBe('9.5 N/mm · 0.97 kgf/mm · 54 lbf/in');
  });
  it('a fork without an adjuster is set with a spacer of the stated length; a fork set reads as one pair, priced per pair', () => {
    expect(row('adjuster')).toBeUndefined();
    expect(row('spacer')).toBe('cut to 85 mm (3.35 in)');
    expect(row('springs')).toBe('1 pair (2 springs): Fork spring pair 9.5 N/mm (LL-F-1)');
    expect(row('price')).toBe('€157.50 per pair');
    expect(row('static-sag')).toBe('29.6 mm ± 3 mm (target 30 mm)');
  });
  it('an lb rider reads each length in inches first, with the mm figure the sheet prints in brackets (1 in = 25.4 mm exactly)', () => {
    const imperial = (key: string) => sheet.ends[0]!.rows.find((r) => r.key === key)?.imperialValue;
    // 12.5 mm ÷ 25.4 = 0.492 in; 85 mm = 3.346 in; 29.6 mm = 1.165 in, 3 mm = 0.118 in, 30 mm = 1.181 in.
    expect(imperial('preload')).toBe('0.49 in (12.5 mm)');
    expect(imperial('spacer')).toBe('cut to 3.35 in (85 mm)');
    expect(imperial('static-sag')).toBe('1.17 in ± 0.12 in, target 1.18 in (29.6 mm ± 3 mm, target 30 mm)');
    expect(row('preload')).toBe('12.5 mm (0.49 in)');
  });
  it('carries the cautions and the steps a spring change disturbs', () => {
    expect(sheet.cautions.join(' ')).toMatch(/Secure the bike/);
    expect(sheet.cautions.join(' ')).toMatch(/store energy/);
    expect(sheet.cautions.join(' ')).toMatch(/maker's figures/);
    expect(sheet.cautions.join(' ')).toMatch(/qualified technician come first/);
    expect(sheet.disturbedSteps.join(' ')).toMatch(/oil level \(or air gap\)/);
    expect(sheet.fittingSteps.some((s) => s.startsWith('Shock'))).toBe(false);
  });
});
