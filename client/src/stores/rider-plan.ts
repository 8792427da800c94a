import { defineStore } from 'pinia';
import { computed, ref, shallowRef, watch } from 'vue';
import { luggageStations, type LuggageStation, type RidingStyle } from '@shared/catalogue/constants';
import type { FitmentDto } from '@shared/catalogue/fitment.dto';
import type { RecommendationDto } from '@shared/catalogue/recommendation.dto';
import { riderRanges } from '@shared/catalogue/ranges';
import type { EngineInputs } from '@shared/recommend/engine-input';
import type { BikeForRecommendationDto } from '@shared/recommend/recommend';
import { shopApi, type RecommendationRequest } from '../api/shop';
import { createShownBeacon } from '../shown-beacon';

type Engine = typeof import('@shared/recommend/recommend');

export type { LuggageStation };
const key = 'loadline.plan';

/** A named load the rider wants the springs to carry too (solo, loaded touring, two-up…). */
export interface PlanLoadCase {
  name: string;
  riderKg: number | null;
  gearKg: number | null;
  passengerKg: number | null;
  luggageKg: Partial<Record<LuggageStation, number | null>>;
}

/** The finder worked out in the browser: the answer, or why there is none yet (per field, like the API's). */
export interface LiveAnswer {
  result?: RecommendationDto;
  problem?: string;
  fields?: Record<string, string>;
}

interface SavedPlan {
  fitmentId: string | null;
  ridingStyle: RidingStyle;
  riderKg: number | null;
  gearKg: number | null;
  passengerKg: number | null;
  luggageKg: Partial<Record<LuggageStation, number | null>>;
  chosenForkId: string | null;
  chosenShockId: string | null;
  cases: PlanLoadCase[];
}

const blank = (): SavedPlan => ({
  fitmentId: null,
  ridingStyle: 'road',
  riderKg: null,
  gearKg: 8,
  passengerKg: null,
  luggageKg: {},
  chosenForkId: null,
  chosenShockId: null,
  cases: [],
});

function load(): SavedPlan {
  try {
    return { ...blank(), ...(JSON.parse(localStorage.getItem(key) ?? '{}') as Partial<SavedPlan>) };
  } catch {
    return blank();
  }
}

/** The rider's bike, load and chosen springs: shared by the finder, the setup sheet and the sag check, kept across visits. */
export const useRiderPlanStore = defineStore('rider-plan', () => {
  const plan = ref<SavedPlan>(load());
  const fitment = ref<FitmentDto | null>(null);
  const result = ref<RecommendationDto | null>(null);
  /** The bike's fitment and fitting springs, fetched once per bike; the shared rule runs on it as the rider types. */
  const bike = ref<BikeForRecommendationDto | null>(null);
  watch(plan, (p) => localStorage.setItem(key, JSON.stringify(p)), { deep: true });

  const chosenFork = computed(() => {
    const f = result.value?.fork;
    return f && 'candidates' in f ? (f.candidates.find((c) => c.id === plan.value.chosenForkId) ?? null) : null;
  });
  const chosenShock = computed(() => {
    const s = result.value?.shock;
    return s && 'candidates' in s ? (s.candidates.find((c) => c.id === plan.value.chosenShockId) ?? null) : null;
  });

  function setResult(r: RecommendationDto) {
    result.value = r;
    // Keep an earlier choice when it still fits; else take the best-placed spring that fits.
    const pick = (end: RecommendationDto['fork'] | RecommendationDto['shock'], current: string | null) => {
      if (!('candidates' in end)) return null;
      const ok = end.candidates.filter((c) => c.verdict === 'ok');
      return ok.find((c) => c.id === current)?.id ?? ok[0]?.id ?? null;
    };
    plan.value.chosenForkId = pick(r.fork, plan.value.chosenForkId);
    plan.value.chosenShockId = pick(r.shock, plan.value.chosenShockId);
  }

  /** The luggage as sent: only stations this bike has and that carry something, in a fixed order. */
  const sentLuggage = computed(() =>
    luggageStations.flatMap((station) => {
      const kg = plan.value.luggageKg[station];
      return kg && fitment.value?.loadStations.some((s) => s.station === station) ? [{ station, massKg: kg }] : [];
    }),
  );
  const hasPassengerSeat = computed(() => fitment.value?.loadStations.some((s) => s.station === 'passenger') ?? false);

  const luggageOf = (kg: Partial<Record<LuggageStation, number | null>>) =>
    luggageStations.flatMap((station) => {
      const m = kg[station];
      return m && fitment.value?.loadStations.some((s) => s.station === station) ? [{ station, massKg: m }] : [];
    });

  /** The load cases as the API takes them; a case's empty rider falls back to the rider entered above. */
  const sentCases = computed(() =>
    plan.value.cases.map((c) => ({
      name: c.name,
      rider: { massKg: c.riderKg ?? plan.value.riderKg, gearKg: c.gearKg ?? plan.value.gearKg ?? 0 },
      luggage: luggageOf(c.luggageKg),
      ...(hasPassengerSeat.value && c.passengerKg ? { passengerKg: c.passengerKg } : {}),
    })),
  );

  function requestBody(): RecommendationRequest | null {
    if (!fitment.value) return null;
    return {
      fitmentId: fitment.value.id,
      ridingStyle: plan.value.ridingStyle,
      rider: { massKg: plan.value.riderKg, gearKg: plan.value.gearKg ?? 0 },
      luggage: sentLuggage.value,
      ...(hasPassengerSeat.value && plan.value.passengerKg ? { passengerKg: plan.value.passengerKg } : {}),
    };
  }

  /** The rider's own checks before the rule runs: the same ranges the API's fields hold. */
  function riderProblems(prefix: string, rider: { massKg: number | null; gearKg: number }): Record<string, string> {
    const out: Record<string, string> = {};
    const m = riderRanges.massKg;
    if (rider.massKg === null || !Number.isFinite(rider.massKg)) out[`${prefix}rider.massKg`] = 'Enter the rider’s weight.';
    else if (rider.massKg < m.min || rider.massKg > m.max) out[`${prefix}rider.massKg`] = `A rider weighs between ${m.min} and ${m.max} kg here.`;
    const gr = riderRanges.gearKg;
    if (!(rider.gearKg >= gr.min && rider.gearKg <= gr.max)) out[`${prefix}rider.gearKg`] = `Riding gear is between ${gr.min} and ${gr.max} kg.`;
    return out;
  }

  /** The engine, in its own chunk fetched beside the first bike: the finder's first paint does not carry it. */
  const engine = shallowRef<Engine | null>(null);
  let engineLoad: Promise<Engine> | undefined;
  function loadEngine(): Promise<Engine> {
    engineLoad ??= import('@shared/recommend/recommend').then((m) => (engine.value = m));
    return engineLoad;
  }

  function answerFor(withCases: boolean): LiveAnswer {
    const body = requestBody();
    const e = engine.value;
    if (!e || !bike.value || !body || bike.value.fitment.id !== body.fitmentId) return {};
    const cases = withCases ? sentCases.value : undefined;
    const fields = { ...riderProblems('', body.rider), ...Object.assign({}, ...(cases ?? []).map((c, i) => riderProblems(`cases.${i}.`, c.rider))) };
    if (Object.keys(fields).length) return { fields };
    try {
      // The checks above leave no empty rider mass.
      const sendable = cases?.map((c) => ({ ...c, rider: { ...c.rider, massKg: c.rider.massKg! } }));
      return { result: e.recommendFor(bike.value, { ...body, rider: { ...body.rider, massKg: body.rider.massKg! }, ...(sendable ? { cases: sendable } : {}) }) };
    } catch (err) {
      if (err instanceof e.RecommendationProblem) return { problem: err.message, fields: err.fields };
      return { problem: err instanceof Error ? err.message : 'This load cannot be worked out.' };
    }
  }

  /** The finder's answer for the load entered, worked out in the browser by the server's own rule on every change. */
  const live = computed<LiveAnswer>(() => answerFor(false));
  /** The same with the rider's load cases: which springs cover all of them, and which case rules each other out. */
  const liveCases = computed<LiveAnswer>(() => (plan.value.cases.length ? answerFor(true) : {}));
  /** The engine input behind `live` (loads placed, targets, springs): the sag chart sweeps it. */
  const liveInputs = computed<EngineInputs | null>(() => {
    const body = requestBody();
    const e = engine.value;
    if (!e || !live.value.result || !bike.value || !body) return null;
    try {
      return e.recommendationInput(bike.value, { ...body, rider: { ...body.rider, massKg: body.rider.massKg! } }).inputs;
    } catch {
      return null;
    }
  });
  // Each load's answer shown is counted once for the dashboard, whether the browser or the server worked it out.
  const beacon = createShownBeacon((fitmentId) => shopApi.shown(fitmentId));
  const loadKey = (body: RecommendationRequest) => JSON.stringify(body);
  watch(live, (a) => {
    if (!a.result) return;
    setResult(a.result);
    const body = requestBody();
    if (body) beacon.shown(loadKey(body), body.fitmentId);
  });

  /** The server's answer for a load (it counted it itself). */
  async function recommendOnServer(body: RecommendationRequest): Promise<RecommendationDto> {
    const r = await shopApi.recommend(body);
    beacon.servedByServer(loadKey(body));
    return r;
  }

  async function loadBike(id: string): Promise<void> {
    if (bike.value?.fitment.id === id) return;
    const [b] = await Promise.all([shopApi.bike(id), loadEngine()]);
    if (plan.value.fitmentId === id) bike.value = b;
  }

  /** Brings back the bike and the result after a reload, from the plan kept in the browser. */
  async function restore(): Promise<void> {
    if (!plan.value.fitmentId) return;
    if (fitment.value?.id !== plan.value.fitmentId) fitment.value = await shopApi.fitment(plan.value.fitmentId);
    await loadBike(plan.value.fitmentId);
    const body = requestBody();
    if (!result.value && body && body.rider.massKg !== null) setResult(await recommendOnServer(body));
  }

  function chooseBike(f: FitmentDto | null) {
    if (f?.id !== plan.value.fitmentId) {
      result.value = null;
      plan.value.luggageKg = {};
      plan.value.passengerKg = null;
    }
    fitment.value = f;
    plan.value.fitmentId = f?.id ?? null;
    if (!f) bike.value = null;
    else if (bike.value?.fitment.id !== f.id) {
      bike.value = null;
      loadBike(f.id).catch(() => undefined);
    }
  }

  return {
    plan,
    fitment,
    bike,
    result,
    live,
    liveCases,
    liveInputs,
    chosenFork,
    chosenShock,
    sentLuggage,
    sentCases,
    hasPassengerSeat,
    requestBody,
    restore,
    setResult,
    recommendOnServer,
    /** Reports the answer on screen now: the rider acts on it, or leaves. */
    reportShown: () => beacon.flush(),
    chooseBike,
  };
});
