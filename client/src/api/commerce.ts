import type { Page } from '@shared/catalogue/common';
import type { CartDto } from '@shared/commerce/cart.dto';
import type { CheckoutResultDto } from '@shared/commerce/checkout.dto';
import type { OrderDto, OrderSummaryDto } from '@shared/commerce/order.dto';
import type { FulfilmentStatus, OrderStatus, PaymentStatus } from '@shared/order-status';
import type { RecommendationRequest } from './shop';
import { api } from './client';

export interface CheckoutRequest {
  email: string;
  shippingAddress: { name: string; line1: string; line2?: string; postalCode: string; city: string; country: string };
}

const q = (token?: string | null) => (token ? `?token=${encodeURIComponent(token)}` : '');

/** The cart, checkout and orders of the shop. */
export const cartApi = {
  get: () => api.get<CartDto>('/cart'),
  add: (productId: string, quantity: number) => api.post<CartDto>('/cart/lines', { productId, quantity }),
  setQuantity: (lineId: string, quantity: number) => api.patch<CartDto>(`/cart/lines/${lineId}`, { quantity }),
  remove: (lineId: string) => api.delete<CartDto>(`/cart/lines/${lineId}`),
  addSpringSet: (body: RecommendationRequest & { forkProductId?: string; shockProductId?: string; acceptVerdict?: boolean }) => api.post<CartDto>('/cart/spring-set', body),
};

export const checkoutApi = {
  placeOrder: (body: CheckoutRequest) => api.post<CheckoutResultDto>('/checkout', body),
};

export const ordersApi = {
  mine: () => api.get<{ items: OrderSummaryDto[] }>('/orders'),
  get: (id: string, token?: string | null) => api.get<OrderDto>(`/orders/${encodeURIComponent(id)}${q(token)}`),
  cancel: (id: string, token?: string | null) => api.post<OrderDto>(`/orders/${encodeURIComponent(id)}/cancel${q(token)}`),
};

export interface StaffOrderFilter {
  status?: OrderStatus;
  paymentStatus?: PaymentStatus;
  fulfilmentStatus?: FulfilmentStatus;
  q?: string;
  page?: number;
  pageSize?: number;
}

export const staffOrdersApi = {
  list: (f: StaffOrderFilter) => {
    const params = new URLSearchParams(Object.entries(f).filter(([, v]) => v !== undefined && v !== '' && v !== null).map(([k, v]) => [k, String(v)]));
    return api.get<Page<OrderSummaryDto>>(`/staff/orders?${params}`);
  },
  get: (id: string) => api.get<OrderDto>(`/staff/orders/${encodeURIComponent(id)}`),
  cancel: (id: string) => api.post<OrderDto>(`/staff/orders/${encodeURIComponent(id)}/cancel`, {}),
  refund: (id: string, body: { lines?: { orderLineId: string; quantity: number; restock: boolean }[]; restock?: boolean; reason?: string }) =>
    api.post<OrderDto>(`/staff/orders/${encodeURIComponent(id)}/refunds`, body),
};
