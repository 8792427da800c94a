/**
 * Formats an amount held in integer minor units (cents) for people, without ever passing through a float:
 * the decimal string is built from the integer and handed to Intl, which formats strings exactly.
 *
 * @example formatMoney(123456, 'EUR') // "€1,234.56"
 */
export function formatMoney(minorUnits: number, currency: string, locale = 'en-GB'): string {
  if (!Number.isSafeInteger(minorUnits)) throw new RangeError(`money must be a whole number of minor units, got ${minorUnits}`);
  const format = new Intl.NumberFormat(locale, { style: 'currency', currency });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  const negative = minorUnits < 0;
  const magnitude = String(Math.abs(minorUnits)).padStart(digits + 1, '0');
  const whole = magnitude.slice(0, magnitude.length - digits);
  const fraction = magnitude.slice(magnitude.length - digits);
  const decimal = `${negative ? '-' : ''}${whole}${digits ? `.${fraction}` : ''}`;
  // Intl.NumberFormat reads a numeric string as an exact decimal (ECMA-402 "Intl.NumberFormat v3").
  return format.format(decimal as unknown as number);
}
