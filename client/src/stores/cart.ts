import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { cartTotals, type CartTotals } from '@shared/cart-totals';
import type { CartDto } from '@shared/commerce/cart.dto';
import { cartApi } from '../api/commerce';

/** The totals the cart shows, from the same shared computation the server answers with. */
export function totalsOf(cart: Pick<CartDto, 'lines' | 'shop'>): CartTotals {
  return cartTotals(cart.lines, cart.shop);
}

/** The rider's cart, shared by the header badge, the drawer and the cart and checkout pages. */
export const useCartStore = defineStore('cart', () => {
  const cart = ref<CartDto | null>(null);
  const drawerOpen = ref(false);
  const loading = ref(false);
  const error = ref('');
  let loadingOnce: Promise<void> | undefined;

  const itemCount = computed(() => cart.value?.itemCount ?? 0);
  const totals = computed(() => (cart.value ? totalsOf(cart.value) : null));
  const blocked = computed(() => cart.value?.lines.some((l) => !l.available) ?? false);

  async function load(force = false): Promise<void> {
    if (!force && loadingOnce) return loadingOnce;
    loading.value = true;
    loadingOnce = cartApi
      .get()
      .then((c) => {
        cart.value = c;
        error.value = '';
      })
      .catch((e: unknown) => {
        error.value = e instanceof Error ? e.message : 'Could not load your cart.';
      })
      .finally(() => (loading.value = false));
    return loadingOnce;
  }

  /** Applies an answer from any cart call: every cart route answers with the whole cart. */
  function set(c: CartDto) {
    cart.value = c;
  }

  return { cart, drawerOpen, loading, error, itemCount, totals, blocked, load, set };
});
