import type { FitmentDto, FitmentSummaryDto, MakeDto } from '@shared/catalogue/fitment.dto';
import type { Page } from '@shared/catalogue/common';
import type { RecommendationDto } from '@shared/catalogue/recommendation.dto';
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
};
