import type { FitmentDto, FitmentSummaryDto, MakeDto } from '@shared/catalogue/fitment.dto';
import type { Page } from '@shared/catalogue/common';
import type { RecommendationDto } from '@shared/catalogue/recommendation.dto';
import type { ProductDto } from '@shared/catalogue/product.dto';
import type { SpringBikeFitDto } from '@shared/catalogue/compatibility.dto';
import type { SetupSheetDto } from '@shared/setup-sheet/setup-sheet.dto';
import type { LuggageStation, RidingStyle } from '@shared/catalogue/constants';
import type { BikeForRecommendationDto } from '@shared/recommend/recommend';
import { api } from './client';

export interface RecommendationRequest {
  fitmentId: string;
  ridingStyle: RidingStyle;
  // null is sent as it is, so the server names the empty field in its answer.
  rider: { massKg: number | null; gearKg: number };
  passengerKg?: number;
  luggage: { station: LuggageStation; massKg: number }[];
}

/** What a rider's pages ask of the public catalogue. */
export const shopApi = {
  makes: () => api.get<MakeDto[]>('/fitments/makes'),
  fitments: (make: string, model: string) =>
    api.get<Page<FitmentSummaryDto>>(`/fitments?${new URLSearchParams({ make, model, pageSize: '100', sort: 'yearFrom' })}`),
  fitment: (id: string) => api.get<FitmentDto>(`/fitments/${encodeURIComponent(id)}`),
  /** The bike's fitment and fitting springs with adapters: the finder runs the shared rule on them in the browser. */
  bike: (fitmentId: string) => api.get<BikeForRecommendationDto>(`/recommendations/bikes/${encodeURIComponent(fitmentId)}`),
  recommend: (body: RecommendationRequest) => api.post<RecommendationDto>('/recommendations', body),
  /** Counts an answer the finder worked out in the browser and showed (the dashboard's recommendations served). */
  shown: (fitmentId: string) => api.post<void>('/recommendations/shown', { fitmentId }),
};

/** The flat setup-sheet query: the same names the server's SetupSheetQueryDto reads. */
export type SetupSheetQuery = Record<string, string>;

/** The rider's catalogue: browsing, one product, the bikes a spring fits, and the setup sheet. */
export const catalogueApi = {
  products: (filter: Record<string, string>) => api.get<Page<ProductDto>>(`/products?${new URLSearchParams(filter)}`),
  product: (id: string) => api.get<ProductDto>(`/products/${encodeURIComponent(id)}`),
  bikes: (id: string) => api.get<{ items: SpringBikeFitDto[] }>(`/products/${encodeURIComponent(id)}/bikes`),
  setupSheet: (q: SetupSheetQuery) => api.get<SetupSheetDto>(`/setup-sheet?${new URLSearchParams(q)}`),
  orderSheet: (orderId: string, token: string | null) => api.get<SetupSheetDto>(`/setup-sheet/orders/${encodeURIComponent(orderId)}${token ? `?token=${encodeURIComponent(token)}` : ''}`),
};

/** The PDF of the same sheet: a plain link, so the browser downloads it. */
export const setupSheetPdfHref = (q: SetupSheetQuery) => `/api/setup-sheet/pdf?${new URLSearchParams(q)}`;
export const orderSheetPdfHref = (orderId: string, token: string | null) =>
  `/api/setup-sheet/orders/${encodeURIComponent(orderId)}/pdf${token ? `?token=${encodeURIComponent(token)}` : ''}`;
