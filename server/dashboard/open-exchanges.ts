import type { ExchangeReason, OpenExchangesDto } from '../../shared/admin/dashboard';

/** What the exchanges service gives the dashboard: its open requests counted by reason. */
export interface OpenExchangesSource {
  openExchangesByReason(): Promise<{ reason: ExchangeReason; count: number }[]>;
}

let source: OpenExchangesSource | undefined;

/** The exchanges module registers its implementation here when it is part of the build. */
export function provideOpenExchanges(s: OpenExchangesSource | undefined): void {
  source = s;
}

export async function openExchanges(): Promise<OpenExchangesDto> {
  if (!source) return { available: false, total: 0, byReason: [] };
  const byReason = await source.openExchangesByReason();
  return { available: true, total: byReason.reduce((n, r) => n + r.count, 0), byReason };
}
