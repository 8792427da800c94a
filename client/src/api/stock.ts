import type { DeliveryReceivedDto, LowStockListDto, StockMovementPageDto, StockProductDto } from '@shared/warehouse/stock.dto';
import { api } from './client';

/** Deliveries in, the stock ledger and what is running low. */
export const stockApi = {
  products: () => api.get<{ items: StockProductDto[] }>('/staff/stock/products'),
  low: () => api.get<LowStockListDto>('/staff/stock/low'),
  movements: (productId?: string) => api.get<StockMovementPageDto>(`/staff/stock/movements${productId ? `?productId=${encodeURIComponent(productId)}` : ''}`),
  receive: (body: { deliveryRef: string; lines: { productId: string; quantity: number }[]; note?: string }) => api.post<DeliveryReceivedDto>('/staff/stock/deliveries', body),
};
