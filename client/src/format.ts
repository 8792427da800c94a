import { nmToFtLbf, nPerMmToKgfPerMm, nPerMmToLbfPerIn } from '@shared/units';

// One locale for the whole back office so figures line up in tables and forms.
const locale = 'en-GB';
const numberFormats = new Map<string, Intl.NumberFormat>();

function numberFormat(min: number, max: number): Intl.NumberFormat {
  const key = `${min}:${max}`;
  let f = numberFormats.get(key);
  if (!f) {
    f = new Intl.NumberFormat(locale, { minimumFractionDigits: min, maximumFractionDigits: max });
    numberFormats.set(key, f);
  }
  return f;
}

/** A number with at most `decimals` decimals (trailing zeros dropped); an em dash for nothing. */
export function formatNumber(value: number | null | undefined, decimals = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return numberFormat(0, decimals).format(value);
}

/** A number with exactly `decimals` decimals, for columns that must line up. */
export function formatFixed(value: number | null | undefined, decimals = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return numberFormat(decimals, decimals).format(value);
}

/** A quantity with its unit after a narrow no-break space, e.g. "12.5 mm". */
export function formatQuantity(value: number | null | undefined, unit: string, decimals = 1): string {
  const n = formatNumber(value, decimals);
  return n === '—' ? n : `${n}\u202f${unit}`;
}

const money = new Map<string, Intl.NumberFormat>();

/** Integer minor units as money, e.g. 12900 → "€129.00". */
export function formatMoney(cents: number | null | undefined, currency = 'EUR'): string {
  if (cents === null || cents === undefined || !Number.isFinite(cents)) return '—';
  let f = money.get(currency);
  if (!f) {
    f = new Intl.NumberFormat(locale, { style: 'currency', currency });
    money.set(currency, f);
  }
  return f.format(cents / 100);
}

/** A torque in N·m with ft·lbf beside it, e.g. "45 N·m (33.2 ft·lbf)". */
export function formatTorque(nm: number | null | undefined): string {
  if (nm === null || nm === undefined || !Number.isFinite(nm)) return '—';
  return `${formatQuantity(nm, 'N·m', 1)} (${formatQuantity(nmToFtLbf(nm), 'ft·lbf', 1)})`;
}

/** Only the ft·lbf part, for a hint beside an N·m input. */
export function formatFtLbf(nm: number | null | undefined): string {
  if (nm === null || nm === undefined || !Number.isFinite(nm)) return '—';
  return formatQuantity(nmToFtLbf(nm), 'ft·lbf', 1);
}

/** A spring rate's other units, e.g. "4.08 kgf/mm · 228 lbf/in". */
export function formatRateAlternatives(nPerMm: number | null | undefined): string {
  if (nPerMm === null || nPerMm === undefined || !Number.isFinite(nPerMm)) return '—';
  return `${formatQuantity(nPerMmToKgfPerMm(nPerMm), 'kgf/mm', 2)} · ${formatQuantity(nPerMmToLbfPerIn(nPerMm), 'lbf/in', 0)}`;
}

/** A spring rate in N/mm with kgf/mm and lbf/in beside it. */
export function formatRate(nPerMm: number | null | undefined): string {
  if (nPerMm === null || nPerMm === undefined || !Number.isFinite(nPerMm)) return '—';
  return `${formatQuantity(nPerMm, 'N/mm', 2)} (${formatRateAlternatives(nPerMm)})`;
}

/** A relative difference as a signed percentage, e.g. 0.062 → "+6.2 %". */
export function formatPercentChange(fraction: number | null | undefined): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return '—';
  const sign = fraction > 0 ? '+' : fraction < 0 ? '−' : '';
  return `${sign}${formatNumber(Math.abs(fraction) * 100, 1)}\u202f%`;
}

const dateTime = new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'short' });

/** An ISO timestamp as a readable local date and time. */
export function formatDateTime(iso: string | null | undefined): string {
  if (!iso) return '—';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? '—' : dateTime.format(d);
}

/** A year range, e.g. "2016–2020" or "2021 on". */
export function formatYears(from: number, to: number | null | undefined): string {
  if (to === null || to === undefined) return `${from} on`;
  return from === to ? String(from) : `${from}–${to}`;
}

/** Euros typed by staff → integer cents, rounding away float noise. */
export function eurosToCents(euros: number): number {
  return Math.round(euros * 100);
}
