import { maxDashboardDays, type DashboardDayDto, type DashboardDto, type LowStockDto, type OpenExchangesDto, type RecommendationShareDto, type TopSpringDto } from '../../shared/admin/dashboard';
import type { DashboardQueryDto } from '../../shared/admin/dashboard.dto';
import { exchangeReasons, openExchangeStates } from '../../shared/exchange-status';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { countExchangesByStateAndReason } from '../exchanges/exchange-staff.service';
import { getShopSettings } from '../shop/shop-settings.service';

// Every figure counts orders by the UTC day they were paid (paid_at), whatever happened to them afterwards:
// revenue is the gross total charged (goods, shipping and VAT) before any refund.
const paidInRange = `o.paid_at >= $1::date::timestamp AT TIME ZONE 'UTC' AND o.paid_at < ($2::date + 1)::timestamp AT TIME ZONE 'UTC'`;

const dayMs = 86_400_000;

function checkRange(q: DashboardQueryDto): void {
  const from = Date.parse(`${q.from}T00:00:00Z`);
  const to = Date.parse(`${q.to}T00:00:00Z`);
  if (Number.isNaN(from)) throw AppError.validation('The range needs attention.', { from: 'The start day is not a date in the calendar.' });
  if (Number.isNaN(to) || new Date(to).toISOString().slice(0, 10) !== q.to) throw AppError.validation('The range needs attention.', { to: 'The end day is not a date in the calendar.' });
  if (new Date(from).toISOString().slice(0, 10) !== q.from) throw AppError.validation('The range needs attention.', { from: 'The start day is not a date in the calendar.' });
  if (to < from) throw AppError.validation('The range needs attention.', { to: 'The end day is on or after the start day.' });
  if ((to - from) / dayMs + 1 > maxDashboardDays) throw AppError.validation('The range needs attention.', { to: `The range is at most ${maxDashboardDays} days.` });
}

async function ordersPerDay(q: DashboardQueryDto): Promise<DashboardDayDto[]> {
  const rows = (await AppDataSource.query(
    `SELECT to_char(d.day, 'YYYY-MM-DD') AS day, count(o.id)::int AS orders, coalesce(sum(o.total_cents), 0)::bigint AS revenue
       FROM generate_series($1::date, $2::date, interval '1 day') AS d(day)
       LEFT JOIN orders o ON o.paid_at >= d.day AT TIME ZONE 'UTC' AND o.paid_at < (d.day + interval '1 day') AT TIME ZONE 'UTC'
      GROUP BY d.day ORDER BY d.day`,
    [q.from, q.to],
  )) as { day: string; orders: number; revenue: string }[];
  return rows.map((r) => ({ day: r.day, orders: r.orders, revenueCents: Number(r.revenue) }));
}

async function topSprings(q: DashboardQueryDto): Promise<TopSpringDto[]> {
  const rows = (await AppDataSource.query(
    `SELECT l.product_id, l.sku, min(l.name) AS name, sum(l.quantity)::int AS units, sum(l.line_total_cents)::bigint AS revenue
       FROM order_lines l JOIN orders o ON o.id = l.order_id
      WHERE l.kind = 'spring' AND ${paidInRange}
      GROUP BY l.product_id, l.sku
      ORDER BY units DESC, revenue DESC, l.sku
      LIMIT 10`,
    [q.from, q.to],
  )) as { product_id: string | null; sku: string; name: string; units: number; revenue: string }[];
  return rows.map((r) => ({ productId: r.product_id, sku: r.sku, name: r.name, unitsSold: r.units, revenueCents: Number(r.revenue) }));
}

/**
 * Of the recommendations served in the range, how many ended in a purchase: the spring sets (a recommendation
 * taken to the cart keeps its spring set on the line) on lines of orders paid in the range, over the answers served.
 */
async function recommendationShare(q: DashboardQueryDto): Promise<RecommendationShareDto> {
  const [row] = (await AppDataSource.query(
    `SELECT (SELECT coalesce(sum(served), 0) FROM recommendation_counts WHERE day BETWEEN $1::date AND $2::date)::int AS served,
            (SELECT count(DISTINCT l.spring_set_id) FROM order_lines l JOIN orders o ON o.id = l.order_id
              WHERE l.spring_set_id IS NOT NULL AND ${paidInRange})::int AS purchased`,
    [q.from, q.to],
  )) as { served: number; purchased: number }[];
  const { served, purchased } = row!;
  return { served, purchased, shareBasisPoints: served ? Math.round((purchased * 10_000) / served) : null };
}

/** Exchanges and returns still open now, whatever day they were asked: the work waiting, not a figure of the range. */
async function openExchanges(): Promise<OpenExchangesDto> {
  const counts = await countExchangesByStateAndReason([...openExchangeStates]);
  const byReason = exchangeReasons.map((reason) => ({ reason, count: counts.filter((c) => c.reason === reason).reduce((n, c) => n + c.count, 0) }));
  return { total: byReason.reduce((n, r) => n + r.count, 0), byReason };
}

async function lowStock(threshold: number): Promise<LowStockDto[]> {
  const rows = (await AppDataSource.query(
    `SELECT id, sku, name, stock_on_hand FROM products WHERE active AND stock_on_hand <= $1 ORDER BY stock_on_hand, sku LIMIT 50`,
    [threshold],
  )) as { id: string; sku: string; name: string; stock_on_hand: number }[];
  return rows.map((r) => ({ productId: r.id, sku: r.sku, name: r.name, stockOnHand: r.stock_on_hand }));
}

/** The dashboard over whole days from `from` to `to`, both included. */
export async function dashboardFor(q: DashboardQueryDto): Promise<DashboardDto> {
  checkRange(q);
  const settings = await getShopSettings();
  const [days, springs, recommendations, exchanges, low] = await Promise.all([
    ordersPerDay(q),
    topSprings(q),
    recommendationShare(q),
    openExchanges(),
    lowStock(settings.lowStockThreshold),
  ]);
  const [totals] = (await AppDataSource.query(
    `SELECT count(*)::int AS orders, coalesce(sum(o.total_cents), 0)::bigint AS revenue FROM orders o WHERE ${paidInRange}`,
    [q.from, q.to],
  )) as { orders: number; revenue: string }[];
  return {
    from: q.from,
    to: q.to,
    currency: settings.currency,
    lowStockThreshold: settings.lowStockThreshold,
    days,
    totals: { orders: totals!.orders, revenueCents: Number(totals!.revenue) },
    topSprings: springs,
    recommendations,
    exchanges,
    lowStock: low,
  };
}
