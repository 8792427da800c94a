import { defineStore } from 'pinia';
import { computed, ref, watch } from 'vue';
import { luggageStations, type LuggageStation, type RidingStyle } from '@shared/catalogue/constants';
import type { FitmentDto } from '@shared/catalogue/fitment.dto';
import type { RecommendationDto } from '@shared/catalogue/recommendation.dto';
import { shopApi, type RecommendationRequest } from '../api/shop';

export type { LuggageStation };
const key = 'loadline.plan';

interface SavedPlan {
  fitmentId: string | null;
  ridingStyle: RidingStyle;
  riderKg: number | null;
  gearKg: number | null;
  passengerKg: number | null;
  luggageKg: Partial<Record<LuggageStation, number | null>>;
  chosenForkId: string | null;
  chosenShockId: string | null;
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

  /** Brings back the bike and the result after a reload, from the plan kept in the browser. */
  async function restore(): Promise<void> {
    if (!plan.value.fitmentId) return;
    if (fitment.value?.id !== plan.value.fitmentId) fitment.value = await shopApi.fitment(plan.value.fitmentId);
    const body = requestBody();
    if (!result.value && body && body.rider.massKg !== null) setResult(await shopApi.recommend(body));
  }

  function chooseBike(f: FitmentDto | null) {
    if (f?.id !== plan.value.fitmentId) {
      result.value = null;
      plan.value.luggageKg = {};
      plan.value.passengerKg = null;
    }
    fitment.value = f;
    plan.value.fitmentId = f?.id ?? null;
  }

  return { plan, fitment, result, chosenFork, chosenShock, sentLuggage, hasPassengerSeat, requestBody, restore, setResult, chooseBike };
});
