import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { UserDto } from '@shared/roles';
import { mayUse, type Area } from '@shared/roles';
import { ApiError, authApi } from '../api/client';

export const useSessionStore = defineStore('session', () => {
  const user = ref<UserDto | null>(null);
  let restoring: Promise<void> | undefined;

  /** Restores the signed-in user once per page load; later calls wait for the same answer. */
  function restore(): Promise<void> {
    restoring ??= authApi
      .me()
      .then((r) => {
        user.value = r.user;
      })
      .catch((e: unknown) => {
        if (!(e instanceof ApiError) || e.status !== 401) console.warn('session restore failed', e);
        user.value = null;
      });
    return restoring;
  }

  async function signIn(email: string, password: string) {
    user.value = (await authApi.login(email, password)).user;
  }

  async function register(body: { email: string; password: string; displayName: string }) {
    user.value = (await authApi.register(body)).user;
  }

  async function signOut() {
    await authApi.logout();
    user.value = null;
  }

  const role = computed(() => user.value?.role);
  const may = (area: Area) => mayUse(role.value, area);

  return { user, role, restore, signIn, register, signOut, may };
});
