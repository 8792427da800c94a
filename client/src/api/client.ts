import type { SessionDto, UserDto } from '@shared/roles';

/** An API refusal as the server sent it: a kind, a readable message and, for forms, a message per field. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

async function request<T>(method: Method, path: string, body?: unknown): Promise<T> {
  let res: Response;
  const isForm = body instanceof FormData;
  try {
    res = await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers: body === undefined || isForm ? { Accept: 'application/json' } : { 'Content-Type': 'application/json', Accept: 'application/json' },
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network', 'Cannot reach Loadline. Check your connection and try again.');
  }
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let data: unknown;
  try {
    data = text ? JSON.parse(text) : undefined;
  } catch {
    data = undefined;
  }
  if (!res.ok) {
    const e = (data ?? {}) as { code?: string; message?: string; fields?: Record<string, string> };
    throw new ApiError(res.status, e.code ?? 'http', e.message ?? `The server answered ${res.status}.`, e.fields ?? {});
  }
  return data as T;
}

export async function download(path: string): Promise<Blob> {
  const res = await fetch(`/api${path}`, { credentials: 'same-origin' });
  if (!res.ok) throw new ApiError(res.status, 'http', `The download failed (${res.status}).`);
  return res.blob();
}

export const api = {
  get: <T>(path: string) => request<T>('GET', path),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, body),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, body),
  delete: <T>(path: string) => request<T>('DELETE', path),
};

export const authApi = {
  me: () => api.get<{ user: UserDto }>('/auth/me'),
  login: (email: string, password: string) => api.post<SessionDto>('/auth/login', { email, password }),
  register: (body: { email: string; password: string; displayName: string }) => api.post<SessionDto>('/auth/register', body),
  logout: () => api.post<void>('/auth/logout'),
  requestReset: (email: string) => api.post<{ message: string }>('/auth/password-reset/request', { email }),
  confirmReset: (token: string, password: string) => api.post<void>('/auth/password-reset/confirm', { token, password }),
};
