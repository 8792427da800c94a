// Types only from the DTO modules (their class-validator decorators must stay out of the bundle); values come from @shared/catalogue/constants.
import type {
  AdapterNeedsDto,
  AuditEntityType,
  CompatibilityOverrideDto,
  AuditEntryDto,
  CsvImportReportDto,
  FitmentCompatibilityDto,
  FitmentDto,
  FitmentInputDto,
  FitmentSummaryDto,
  ImageOrderDto,
  Page,
  ProductInputDto,
  ProductKind,
  SpringEnd,
  SpringFitDto,
  SpringOptionsDto,
  StaffProductDto,
  StockUpdateDto,
} from '@shared/catalogue';
import { withTableQuery, type TableQuery } from '../composables/useLazyTable';
import { api, ApiError, download } from './client';

/** Fields of the request classes without their decorators' class identity, as the client builds them. */
export type FitmentInput = { [K in keyof FitmentInputDto]: FitmentInputDto[K] };
export type ProductInput = { [K in keyof ProductInputDto]: ProductInputDto[K] };

export interface ProductListFilters {
  kind?: ProductKind;
  end?: SpringEnd;
  active?: 'true' | 'false';
  inStock?: 'true' | 'false';
}

/** A CSV upload: fetch sends it raw with its own content type, which the JSON helper would not. */
async function postCsv(path: string, csv: string): Promise<CsvImportReportDto> {
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { 'Content-Type': 'text/csv', Accept: 'application/json' },
      body: csv,
    });
  } catch {
    throw new ApiError(0, 'network', 'Cannot reach Loadline. Check your connection and try again.');
  }
  const data = (await res.json().catch(() => undefined)) as
    | (CsvImportReportDto & { code?: string; message?: string; details?: CsvImportReportDto; fields?: Record<string, string> })
    | undefined;
  if (res.ok && data) return data;
  // A refused import still carries its report, so the page can list every problem.
  if (res.status === 400 && data?.details) return data.details;
  throw new ApiError(res.status, data?.code ?? 'http', data?.message ?? `The server answered ${res.status}.`, data?.fields ?? {});
}

const springOnFitment = (fitmentId: string, productId: string, what: 'override' | 'adapters') =>
  `/staff/fitments/${encodeURIComponent(fitmentId)}/springs/${encodeURIComponent(productId)}/${what}`;

export const staffCatalogue = {
  listFitments: (q: TableQuery) => api.get<Page<FitmentSummaryDto>>(withTableQuery('/staff/fitments', q)),
  getFitment: (id: string) => api.get<FitmentDto>(`/staff/fitments/${encodeURIComponent(id)}`),
  createFitment: (body: FitmentInput) => api.post<FitmentDto>('/staff/fitments', body),
  updateFitment: (id: string, body: FitmentInput) => api.put<FitmentDto>(`/staff/fitments/${encodeURIComponent(id)}`, body),
  deleteFitment: (id: string) => api.delete<void>(`/staff/fitments/${encodeURIComponent(id)}`),
  exportFitments: () => download('/staff/fitments/export.csv'),
  previewImport: (csv: string) => postCsv('/staff/fitments/import/preview', csv),
  commitImport: (csv: string) => postCsv('/staff/fitments/import', csv),

  listProducts: (q: TableQuery, filters: ProductListFilters = {}) =>
    api.get<Page<StaffProductDto>>(withTableQuery('/staff/products', q, { ...filters })),
  getProduct: (id: string) => api.get<StaffProductDto>(`/staff/products/${encodeURIComponent(id)}`),
  createProduct: (body: ProductInput) => api.post<StaffProductDto>('/staff/products', body),
  updateProduct: (id: string, body: ProductInput) => api.put<StaffProductDto>(`/staff/products/${encodeURIComponent(id)}`, body),
  deleteProduct: (id: string) => api.delete<void>(`/staff/products/${encodeURIComponent(id)}`),
  updateStock: (id: string, body: StockUpdateDto) => api.patch<StaffProductDto>(`/staff/products/${encodeURIComponent(id)}/stock`, body),
  uploadImage: (id: string, file: File) => {
    const form = new FormData();
    form.append('image', file, file.name);
    return api.post<StaffProductDto>(`/staff/products/${encodeURIComponent(id)}/images`, form);
  },
  reorderImages: (id: string, body: ImageOrderDto) => api.put<StaffProductDto>(`/staff/products/${encodeURIComponent(id)}/images/order`, body),
  deleteImage: (id: string, imageId: string) =>
    api.delete<StaffProductDto>(`/staff/products/${encodeURIComponent(id)}/images/${encodeURIComponent(imageId)}`),
  springOptions: () => api.get<SpringOptionsDto>('/staff/spring-options'),

  compatibility: (fitmentId: string) => api.get<FitmentCompatibilityDto>(`/staff/fitments/${encodeURIComponent(fitmentId)}/compatibility`),
  setFitOverride: (fitmentId: string, productId: string, body: CompatibilityOverrideDto) => api.put<SpringFitDto>(springOnFitment(fitmentId, productId, 'override'), body),
  clearFitOverride: (fitmentId: string, productId: string) => api.delete<SpringFitDto>(springOnFitment(fitmentId, productId, 'override')),
  setAdapters: (fitmentId: string, productId: string, body: AdapterNeedsDto) => api.put<SpringFitDto>(springOnFitment(fitmentId, productId, 'adapters'), body),

  listAudit: (q: TableQuery, filters: { entityType?: AuditEntityType; entityId?: string } = {}) =>
    api.get<Page<AuditEntryDto>>(withTableQuery('/staff/audit', q, filters)),
};
