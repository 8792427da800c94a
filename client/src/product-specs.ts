import type { ProductKind, SpringEnd } from '@shared/catalogue/constants';
import type { SpringDetailsDto } from '@shared/catalogue/product.dto';
import { saleUnits } from '@shared/catalogue/sale-unit';
import { formatInches, formatLength } from '@shared/length-format';
import { nPerMmToKgfPerMm, nPerMmToLbfPerIn } from '@shared/units';
import { formatNumber } from './format';

/** One specification in both unit systems, as the product page's table shows it. */
export interface SpecRow {
  label: string;
  metric: string;
  imperial: string;
}

const length = (label: string, mm: number): SpecRow => ({ label, metric: formatLength(mm, 'metric', { gap: ' ' }), imperial: formatInches(mm, { gap: ' ' }) });

/** A spring's figures in SI and in the units riders also quote (kgf/mm, lbf/in, in), all through shared/units (mathjs). */
export function springSpecRows(s: SpringDetailsDto): SpecRow[] {
  return [
    { label: `Rate, ${s.end === 'fork' ? 'each spring of the pair' : 'per spring'}`, metric: `${formatNumber(s.rateNPerMm, 2)} N/mm · ${formatNumber(nPerMmToKgfPerMm(s.rateNPerMm), 2)} kgf/mm`, imperial: `${formatNumber(nPerMmToLbfPerIn(s.rateNPerMm), 1)} lbf/in` },
    length('Free length', s.freeLengthMm),
    length('Inner diameter', s.innerDiameterMm),
    length('Outer diameter', s.outerDiameterMm),
    length('Wire diameter', s.wireDiameterMm),
    length('Solid length', s.solidLengthMm),
    { label: 'Total coils', metric: formatNumber(s.totalCoils, 1), imperial: formatNumber(s.totalCoils, 1) },
  ];
}

const kindWords: Record<ProductKind, string> = { spring: 'Spring', adapter: 'Adapter', tool: 'Tool', accessory: 'Accessory' };

/** "Fork spring, sold as a pair", "Shock spring", "Tool". */
export function productKindWords(kind: ProductKind, end: SpringEnd | null | undefined): string {
  if (kind !== 'spring' || !end) return kindWords[kind];
  return end === 'fork' ? 'Fork springs, sold as a pair' : 'Shock spring, sold singly';
}

/** "per pair", "per spring" or "" for a product sold by the piece. */
export function pricePer(kind: ProductKind, end: SpringEnd | null | undefined): string {
  return kind === 'spring' && end ? saleUnits[end].perUnit : '';
}
