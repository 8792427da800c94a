import type { CurrencyCode, RateInUnitsDto, RidingStyle, SpringEnd } from '../catalogue/constants';

/** One labelled figure as the page and the PDF both print it. */
export interface SheetRowDto {
  /** Stable name for tests and styling, e.g. "preload", "adjuster". */
  key: string;
  label: string;
  value: string;
  /** For a length: inches first with mm in brackets, as an lb rider's page shows it. */
  imperialValue?: string;
}

/** One end's spring and how to set it up. Lengths in mm, rates in N/mm; null where the source does not say. */
export interface SetupSheetEndDto {
  end: SpringEnd;
  title: string;
  productId: string;
  sku: string;
  name: string;
  /** Springs fitted at this end (2 for most forks, 2 for twin shocks). */
  springCount: number;
  /** Units of the product bought for them: pairs for a fork, springs for a shock. */
  units: number;
  unitWords: string;
  unitPriceCents: number | null;
  currency: CurrencyCode;
  rate: RateInUnitsDto;
  freeLengthMm: number | null;
  preloadMm: number;
  adjusterTurns: number | null;
  spacerLengthMm: number | null;
  installedLengthMm: number | null;
  staticSagMm: number;
  riderSagMm: number;
  toleranceMm: number;
  targets: { staticSagMm: number; riderSagMm: number };
  adapters: { sku: string; name: string; quantity: number }[];
  rows: SheetRowDto[];
}

export interface SheetTorqueDto {
  fastener: string;
  torqueNm: number;
  torqueFtLbf: number;
  /** "45 N·m (33.2 ft·lbf)" */
  text: string;
}

/** Everything the setup sheet shows; the page and the PDF both render this one object. */
export interface SetupSheetDto {
  bikeLabel: string;
  ridingStyle: RidingStyle;
  /** Where the figures come from: a rider's plan worked out now, or an order's spring set as bought. */
  source: 'plan' | 'order';
  orderNumber: string | null;
  loadLines: string[];
  ends: SetupSheetEndDto[];
  torques: SheetTorqueDto[];
  tools: string[];
  bikeNotes: string;
  cautions: string[];
  fittingSteps: string[];
  disturbedSteps: string[];
  afterFitting: string;
}
