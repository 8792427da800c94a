import { isCasesRecommendation, type RecommendationDto, type RecommendationRequestDto, type RecommendedSpringDto, type SpringEnd } from '../../shared/catalogue';
import { buildSetupSheet, type EndFigures, type SheetInput } from '../../shared/setup-sheet/build';
import type { SetupSheetDto } from '../../shared/setup-sheet/setup-sheet.dto';
import type { OrderSheetQueryDto, SetupSheetQueryDto } from '../../shared/setup-sheet/setup-sheet-query.dto';
import type { User } from '../accounts/User.entity';
import type { Config } from '../config';
import { AppError } from '../errors';
import { findFitment, toFitmentDto } from '../fitment/fitment.service';
import { viewOrder } from '../orders/orders.service';
import { recommend, type BikeCache } from '../recommendations/recommendations.service';

function requestOf(q: SetupSheetQueryDto): RecommendationRequestDto {
  const luggage = (
    [
      ['tank-bag', q.tankBagKg],
      ['panniers', q.panniersKg],
      ['top-case', q.topCaseKg],
    ] as const
  ).flatMap(([station, massKg]) => (massKg ? [{ station, massKg }] : []));
  return {
    fitmentId: q.fitmentId,
    ridingStyle: q.ridingStyle,
    rider: { massKg: q.riderKg, gearKg: q.gearKg ?? 0 },
    luggage,
    ...(q.passengerKg ? { passengerKg: q.passengerKg } : {}),
  } as RecommendationRequestDto;
}

/** The chosen spring's figures for the load as entered (with cases, the first case is the load as entered). */
function candidateOf(r: RecommendationDto, end: SpringEnd, id: string): RecommendedSpringDto | undefined {
  const e = r[end];
  const list = isCasesRecommendation(e) ? e.cases[0]?.candidates : e.candidates;
  return list?.find((c) => c.id === id.toLowerCase());
}

async function bikeData(fitmentId: string | null) {
  const f = fitmentId ? await findFitment(fitmentId) : null;
  return f ? toFitmentDto(f) : null;
}

/** The sheet for a rider's bike, load and chosen springs, worked out now by the same engine run as the finder's. */
export async function sheetForPlan(q: SetupSheetQueryDto, cache: BikeCache): Promise<SetupSheetDto> {
  if (!q.forkId && !q.shockId) throw AppError.validation('Choose a fork or a shock spring for the sheet.', { forkId: 'Choose a fork spring, a shock spring or both.' });
  const r = await recommend(requestOf(q), cache);
  const fitment = (await bikeData(q.fitmentId))!;
  const ends: EndFigures[] = [];
  const problems: Record<string, string> = {};
  for (const [end, id, field] of [['fork', q.forkId, 'forkId'], ['shock', q.shockId, 'shockId']] as const) {
    if (!id) continue;
    const c = candidateOf(r, end, id);
    if (!c) {
      problems[field] = `That ${end} spring is not one the shop offers for this bike.`;
      continue;
    }
    const targets = r.targets[end];
    ends.push({
      end,
      productId: c.id,
      sku: c.sku,
      name: c.name,
      springCount: end === 'fork' ? fitment.forkSpringCount : fitment.shockCount,
      rateNPerMm: c.rateNPerMm,
      freeLengthMm: c.freeLengthMm,
      preloadMm: c.preloadMm,
      adjusterTurns: c.adjusterTurns ?? null,
      spacerLengthMm: c.spacerLengthMm ?? null,
      installedLengthMm: c.installedLengthMm,
      staticSagMm: c.staticSagMm,
      riderSagMm: c.riderSagMm,
      toleranceMm: targets.staticSagToleranceMm,
      targets: { staticSagMm: targets.staticSagMm, riderSagMm: targets.riderSagMm },
      unitPriceCents: c.priceCents,
      currency: c.currency,
      adapters: c.adapters.map((a) => ({ sku: a.sku, name: a.name, quantity: a.quantity })),
    });
  }
  if (Object.keys(problems).length) throw AppError.validation(Object.values(problems)[0]!, problems);
  const input: SheetInput = {
    source: 'plan',
    orderNumber: null,
    bikeLabel: bikeLabel(r.fitment),
    ridingStyle: r.ridingStyle,
    loads: r.loads,
    ends,
    bike: { torques: fitment.torques, tools: fitment.tools, notes: fitment.notes },
  };
  return buildSetupSheet(input);
}

const bikeLabel = (f: RecommendationDto['fitment']) => `${[f.make, f.model, f.variant].filter(Boolean).join(' ')} (${f.yearFrom}–${f.yearTo})`;

/** The sheet for one spring set of an order, from the figures kept with it when it was bought. */
export async function sheetForOrder(config: Config, viewer: User | undefined, orderId: string, q: OrderSheetQueryDto): Promise<SetupSheetDto> {
  const order = await viewOrder(config, viewer, orderId, q.token);
  const set = q.setId ? order.sets.find((s) => s.id === q.setId?.toLowerCase()) : order.sets[0];
  if (!set) throw AppError.notFound('The spring set');
  const fitment = await bikeData(set.fitmentId);
  const priceOf = (productId: string) => order.lines.find((l) => l.springSetId === set.id && l.productId === productId)?.unitPriceCents ?? null;
  const ends: EndFigures[] = set.setup.map((s) => ({
    end: s.end,
    productId: s.productId,
    sku: s.sku,
    name: s.springName,
    springCount: s.springCount,
    rateNPerMm: s.rateNPerMm,
    freeLengthMm: null,
    preloadMm: s.preloadMm,
    adjusterTurns: s.adjusterTurns ?? null,
    spacerLengthMm: null,
    installedLengthMm: null,
    staticSagMm: s.staticSagMm,
    riderSagMm: s.riderSagMm,
    toleranceMm: s.toleranceMm,
    targets: s.targets,
    unitPriceCents: priceOf(s.productId),
    currency: 'EUR',
    adapters: [],
  }));
  return buildSetupSheet({
    source: 'order',
    orderNumber: order.number,
    bikeLabel: set.bikeLabel,
    ridingStyle: set.ridingStyle,
    loads: set.loads,
    ends,
    bike: fitment && { torques: fitment.torques, tools: fitment.tools, notes: fitment.notes },
  });
}
