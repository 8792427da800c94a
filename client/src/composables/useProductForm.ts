import type { StaffProductDto } from '@shared/catalogue';
import { currency, skuPattern, type ProductKind, type SpringEnd, type SpringEndType } from '@shared/catalogue/constants';
import type { ProductInput } from '../api/staff-catalogue';
import { eurosToCents } from '../format';
import { springRanges } from '@shared/catalogue/ranges';
import { checkQuantity, type QuantitySpec } from './useFitmentForm';

type N = number | null;

export interface SpringDraft {
  end: SpringEnd | null;
  rateNPerMm: N;
  freeLengthMm: N;
  innerDiameterMm: N;
  outerDiameterMm: N;
  wireDiameterMm: N;
  totalCoils: N;
  endType: SpringEndType | null;
  material: string | null;
  solidLengthMm: N;
}

export interface ProductDraft {
  sku: string;
  name: string;
  kind: ProductKind;
  description: string;
  /** Staff type euros; the API takes integer cents. */
  priceEuros: N;
  stockOnHand: N;
  binLocation: string;
  active: boolean;
  spring: SpringDraft;
}

export const emptySpringDraft = (): SpringDraft => ({
  end: null,
  rateNPerMm: null,
  freeLengthMm: null,
  innerDiameterMm: null,
  outerDiameterMm: null,
  wireDiameterMm: null,
  totalCoils: null,
  endType: null,
  material: null,
  solidLengthMm: null,
});

export const emptyProductDraft = (): ProductDraft => ({
  sku: '',
  name: '',
  kind: 'spring',
  description: '',
  priceEuros: null,
  stockOnHand: 0,
  binLocation: '',
  active: true,
  spring: emptySpringDraft(),
});

export function draftFromProduct(p: StaffProductDto): ProductDraft {
  const s = p.spring;
  return {
    sku: p.sku,
    name: p.name,
    kind: p.kind,
    description: p.description,
    priceEuros: p.priceCents / 100,
    stockOnHand: p.stockOnHand,
    binLocation: p.binLocation,
    active: p.active,
    spring: s
      ? {
          end: s.end,
          rateNPerMm: s.rateNPerMm,
          freeLengthMm: s.freeLengthMm,
          innerDiameterMm: s.innerDiameterMm,
          outerDiameterMm: s.outerDiameterMm,
          wireDiameterMm: s.wireDiameterMm,
          totalCoils: s.totalCoils,
          endType: s.endType,
          material: s.material,
          solidLengthMm: s.solidLengthMm,
        }
      : emptySpringDraft(),
  };
}

/** The request body; call after `checkProductDraft` found nothing. */
export function productInputFromDraft(d: ProductDraft): ProductInput {
  const s = d.spring;
  return {
    sku: d.sku.trim(),
    name: d.name.trim(),
    kind: d.kind,
    description: d.description,
    priceCents: eurosToCents(d.priceEuros as number),
    currency,
    stockOnHand: d.stockOnHand as number,
    binLocation: d.binLocation.trim(),
    active: d.active,
    spring:
      d.kind === 'spring'
        ? {
            end: s.end as SpringEnd,
            rateNPerMm: s.rateNPerMm as number,
            freeLengthMm: s.freeLengthMm as number,
            innerDiameterMm: s.innerDiameterMm,
            outerDiameterMm: s.outerDiameterMm as number,
            wireDiameterMm: s.wireDiameterMm as number,
            totalCoils: s.totalCoils as number,
            endType: s.endType as SpringEndType,
            material: s.material as string,
            solidLengthMm: s.solidLengthMm,
          }
        : null,
  };
}

// The server's ranges (one shared table), so staff see its rule while still on the field.
const springSpecs = {
  rateNPerMm: { label: 'Rate', ...springRanges.rateNPerMm },
  freeLengthMm: { label: 'Free length', ...springRanges.freeLengthMm },
  wireDiameterMm: { label: 'Wire diameter', ...springRanges.wireDiameterMm },
  outerDiameterMm: { label: 'Outer diameter', ...springRanges.outerDiameterMm },
  totalCoils: { label: 'Total coils', ...springRanges.totalCoils },
  innerDiameterMm: { label: 'Inner diameter', ...springRanges.innerDiameterMm, optional: true },
  solidLengthMm: { label: 'Solid length', ...springRanges.solidLengthMm, optional: true },
} as const satisfies Record<string, QuantitySpec>;

/** Cheap checks before sending; keys are the server's field paths (`spring.wireDiameterMm`). */
export function checkProductDraft(d: ProductDraft): Record<string, string> {
  const p: Record<string, string> = {};
  const put = (k: string, m: string) => {
    if (m && !p[k]) p[k] = m;
  };
  if (!skuPattern.test(d.sku.trim())) put('sku', 'A SKU has 3 to 40 capital letters, digits and dashes.');
  if (!d.name.trim()) put('name', 'Enter a name.');
  put('priceCents', checkQuantity(d.priceEuros, { label: 'Price', unit: '€', min: 0, max: 100_000 }));
  put('stockOnHand', checkQuantity(d.stockOnHand, { label: 'Stock on hand', unit: 'pieces', min: 0, max: 100_000, integer: true }));
  if (d.binLocation.trim().length > 20) put('binLocation', 'A bin location has at most 20 characters.');
  if (d.kind === 'spring') {
    const s = d.spring;
    if (!s.end) put('spring.end', 'Choose fork or shock.');
    if (!s.endType) put('spring.endType', 'Choose the end type.');
    if (!s.material) put('spring.material', 'Choose a material.');
    for (const [k, spec] of Object.entries(springSpecs)) put(`spring.${k}`, checkQuantity(s[k as keyof typeof springSpecs], { ...spec, phrasing: 'named' }));
  }
  return p;
}
