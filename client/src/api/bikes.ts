import type { BikeDto, BikeSagCheckDto, BikeSummaryDto, SagReadings } from '@shared/bikes';
import type { OrderSummaryDto } from '@shared/commerce/order.dto';
import type { RidingStyle } from '@shared/catalogue/constants';
import type { LuggageStation } from '@shared/catalogue/constants';
import { api } from './client';

export interface LoadSetBody {
  rider: { massKg: number | null; gearKg: number };
  passengerKg?: number;
  luggage: { station: LuggageStation; massKg: number }[];
}

export interface SaveBikeBody {
  nickname: string;
  fitmentId: string;
  ridingStyle: RidingStyle;
  load: LoadSetBody;
  cases?: (LoadSetBody & { name: string })[];
  forkSpringId?: string;
  shockSpringId?: string;
}

const at = (id: string) => `/bikes/${encodeURIComponent(id)}`;

/** The signed-in rider's saved bikes and their sag-check history. */
export const bikesApi = {
  list: () => api.get<{ items: BikeSummaryDto[] }>('/bikes'),
  get: (id: string) => api.get<BikeDto>(at(id)),
  save: (body: SaveBikeBody) => api.post<BikeDto>('/bikes', body),
  update: (id: string, body: SaveBikeBody) => api.put<BikeDto>(at(id), body),
  rename: (id: string, nickname: string) => api.patch<BikeDto>(at(id), { nickname }),
  remove: (id: string) => api.delete<void>(at(id)),
  sagChecks: (id: string) => api.get<{ items: BikeSagCheckDto[] }>(`${at(id)}/sag-checks`),
  addSagCheck: (id: string, readings: SagReadings) => api.post<BikeSagCheckDto>(`${at(id)}/sag-checks`, readings),
  removeSagCheck: (id: string, checkId: string) => api.delete<void>(`${at(id)}/sag-checks/${encodeURIComponent(checkId)}`),
  orders: (id: string) => api.get<{ items: OrderSummaryDto[] }>(`${at(id)}/orders`),
};
