import type { FulfilmentStatus } from '@shared/order-status';
import type { PickListDto, WarehouseQueueDto } from '@shared/warehouse/fulfilment.dto';
import { api } from './client';

const order = (id: string) => `/warehouse/orders/${encodeURIComponent(id)}`;

/** The warehouse's queue and each step of pick, pack, ship and deliver. */
export const warehouseApi = {
  queue: (state?: FulfilmentStatus) => api.get<WarehouseQueueDto>(`/warehouse/orders${state ? `?state=${encodeURIComponent(state)}` : ''}`),
  get: (id: string) => api.get<PickListDto>(order(id)),
  scan: (id: string, code: string) => api.post<PickListDto>(`${order(id)}/scan`, { code }),
  setPicked: (id: string, lineId: string, pickedQuantity: number) => api.put<PickListDto>(`${order(id)}/lines/${encodeURIComponent(lineId)}/picked`, { pickedQuantity }),
  pack: (id: string) => api.post<PickListDto>(`${order(id)}/pack`),
  ship: (id: string, body: { carrier: string; trackingNumber: string }) => api.post<PickListDto>(`${order(id)}/ship`, body),
  deliver: (id: string) => api.post<PickListDto>(`${order(id)}/deliver`),
};
