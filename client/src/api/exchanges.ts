import type { ExchangeDto, ExchangeProposalDto } from '@shared/commerce/exchange.dto';
import type { SagCheckResult } from '@shared/engine/types';
import type { ExchangeKind, ExchangeReason, ExchangeState } from '@shared/exchange-status';
import { api } from './client';

export interface SagCheckBody {
  end: 'front' | 'rear';
  extendedMm: number;
  staticMm: number;
  riderMm: number;
  targets: { staticSagMm: number; riderSagMm: number };
  toleranceMm?: number;
  leverageRatio?: number;
  adjusterPitchMm?: number;
}

export interface ExchangeRequestBody {
  orderLineId: string;
  kind: ExchangeKind;
  reason: ExchangeReason;
  reasonText?: string;
  replacementProductId?: string;
  sagCheck?: SagCheckBody;
}

const enc = encodeURIComponent;
const filter = (f: { state?: ExchangeState; reason?: ExchangeReason }) => new URLSearchParams(Object.entries(f).filter(([, v]) => v) as [string, string][]).toString();

/** A rider's exchanges and returns. */
export const exchangesApi = {
  proposal: (orderLineId: string, reason?: ExchangeReason) => api.get<ExchangeProposalDto>(`/exchanges/proposal?orderLineId=${enc(orderLineId)}${reason ? `&reason=${reason}` : ''}`),
  request: (body: ExchangeRequestBody) => api.post<ExchangeDto>('/exchanges', body),
  mine: () => api.get<{ items: ExchangeDto[] }>('/exchanges'),
  /** The same sag check the rider's page runs, to show its verdict before the request is sent. */
  previewSagCheck: (body: SagCheckBody) => api.post<SagCheckResult>('/calculations/sag-check', body),
};

export const staffExchangesApi = {
  list: (f: { state?: ExchangeState; reason?: ExchangeReason }) => api.get<{ items: ExchangeDto[] }>(`/staff/exchanges?${filter(f)}`),
  decide: (id: string, approve: boolean, message: string) => api.post<ExchangeDto>(`/staff/exchanges/${enc(id)}/decision`, { approve, message }),
};

export const warehouseExchangesApi = {
  list: (state: ExchangeState) => api.get<{ items: ExchangeDto[] }>(`/warehouse/exchanges?${filter({ state })}`),
  receive: (id: string) => api.post<ExchangeDto>(`/warehouse/exchanges/${enc(id)}/receive`),
  ship: (id: string, carrier: string, trackingNumber: string) => api.post<ExchangeDto>(`/warehouse/exchanges/${enc(id)}/ship`, { carrier, trackingNumber }),
};
