import { ref } from 'vue';
import { ApiError } from '../api/client';

/** Runs a form submission: tracks the wait, the general message and the per-field messages the server sent. */
export function useSubmit() {
  const busy = ref(false);
  const error = ref('');
  const fields = ref<Record<string, string>>({});

  async function run<T>(action: () => Promise<T>): Promise<T | undefined> {
    busy.value = true;
    error.value = '';
    fields.value = {};
    try {
      return await action();
    } catch (e) {
      if (e instanceof ApiError) {
        error.value = e.message;
        fields.value = e.fields;
      } else {
        error.value = 'Something went wrong. Please try again.';
        console.error(e);
      }
      return undefined;
    } finally {
      busy.value = false;
    }
  }

  return { busy, error, fields, run };
}
