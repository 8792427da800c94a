import { useRouter } from 'vue-router';
import type { BikeDto } from '@shared/bikes';
import type { LoadSetBody } from '../api/bikes';
import { planFromBike } from '../bike-plan';
import { to } from '../router';
import { useRiderPlanStore } from '../stores/rider-plan';

const reopenedKey = 'loadline.reopened-bike';

export interface ReopenedBike {
  id: string;
  nickname: string;
  fitmentId: string;
}

/** The saved bike the finder was last reopened from in this tab, so "Save" can offer to update it. */
export function reopenedBike(): ReopenedBike | null {
  try {
    return JSON.parse(sessionStorage.getItem(reopenedKey) ?? 'null') as ReopenedBike | null;
  } catch {
    return null;
  }
}

/** Moves a saved bike into the finder's plan (the Pinia store the finder, setup sheet and sag check share) and back. */
export function useBikePlan() {
  const store = useRiderPlanStore();
  const router = useRouter();

  /** The load cases the finder holds, as the API takes them (none while the finder does not offer cases). */
  function plannedCases(): (LoadSetBody & { name: string })[] {
    return (store as unknown as { sentCases?: (LoadSetBody & { name: string })[] }).sentCases ?? [];
  }

  /** Reopens the finder or the setup sheet with the bike's state; false when the bike is no longer in the shop's list. */
  async function open(bike: BikeDto, page: 'find-springs' | 'setup-sheet'): Promise<boolean> {
    const plan = planFromBike(bike);
    if (!plan) return false;
    store.result = null;
    store.fitment = null;
    Object.assign(store.plan, plan);
    sessionStorage.setItem(reopenedKey, JSON.stringify({ id: bike.id, nickname: bike.nickname, fitmentId: plan.fitmentId } satisfies ReopenedBike));
    // Works the springs out again for the saved load, so the page opens on an answer (a failure leaves the form to say why).
    await store.restore().catch(() => undefined);
    await router.push(to(page));
    return true;
  }

  return { open, plannedCases };
}
