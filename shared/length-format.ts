import { mmToIn } from './units';

/** The rider's choice: kg and mm, or lb and in. Values inside stay SI. */
export type UnitSystem = 'metric' | 'imperial';

/** How a length is written: mm alone, inches first with mm in brackets, or mm first with inches in brackets (sheets). */
export type LengthStyle = UnitSystem | 'both';

export interface LengthFormatOptions {
  /** Most decimals for the mm figure (trailing zeros dropped); 1 unless told. */
  mmDecimals?: number;
  /** Most decimals for the inch figure; 2 unless told (0.01 in is a quarter of a millimetre). */
  inDecimals?: number;
  /** Between a figure and its unit: a narrow no-break space on screen unless told. */
  gap?: string;
}

const formats = new Map<number, Intl.NumberFormat>();
function figure(v: number, decimals: number): string {
  let f = formats.get(decimals);
  if (!f) formats.set(decimals, (f = new Intl.NumberFormat('en-GB', { maximumFractionDigits: decimals })));
  // −0 and a rounding to zero both print as "0", never "-0".
  const text = f.format(v);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/**
 * One length as a person reads it, in the rider's units; the one way every page writes a length.
 * Inches come from shared/units (mathjs).
 * @example formatLength(12.5, 'metric') // "12.5 mm"
 * @example formatLength(12.5, 'imperial') // "0.49 in (12.5 mm)"
 * @example formatLength(12.5, 'both', { gap: ' ' }) // "12.5 mm (0.49 in)"
 */
export function formatLength(mm: number | null | undefined, style: LengthStyle, options: LengthFormatOptions = {}): string {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return '—';
  const gap = options.gap ?? '\u202f';
  const metric = `${figure(mm, options.mmDecimals ?? 1)}${gap}mm`;
  if (style === 'metric') return metric;
  const inches = formatInches(mm, options);
  return style === 'imperial' ? `${inches} (${metric})` : `${metric} (${inches})`;
}

/**
 * Only the inch figure of a length, for a hint beside a field typed in mm.
 * @example formatInches(600) // "23.62 in"
 */
export function formatInches(mm: number | null | undefined, options: LengthFormatOptions = {}): string {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return '—';
  return `${figure(mmToIn(mm), options.inDecimals ?? 2)}${options.gap ?? '\u202f'}in`;
}

/**
 * A length with a sign, for changes: each figure carries it ("+5 mm", "−0.2 in (−5 mm)"); a change that rounds to zero has none.
 * @example formatLengthChange(-5, 'metric') // "−5 mm"
 */
export function formatLengthChange(mm: number | null | undefined, style: LengthStyle, options: LengthFormatOptions = {}): string {
  if (mm === null || mm === undefined || !Number.isFinite(mm)) return '—';
  const sign = mm > 0 ? '+' : '−';
  // Each figure is signed only when it does not round to zero in its own unit.
  return formatLength(Math.abs(mm), style, options).replace(/(^|\()([\d.,]+)/g, (_, lead: string, n: string) => (/[1-9]/.test(n) ? `${lead}${sign}${n}` : `${lead}${n}`));
}
