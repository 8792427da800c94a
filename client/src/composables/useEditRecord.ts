import type { ToastMessageOptions } from 'primevue/toast';
import { useConfirm } from 'primevue/useconfirm';
import { useToast } from 'primevue/usetoast';
import { computed, ref, watch, type Ref } from 'vue';
import { useRouter } from 'vue-router';
import { ApiError } from '../api/client';
import { to, type RouteName } from '../router';
import { useSubmit } from './useSubmit';

export interface EditRecordOptions<R extends { id: string }, D, I> {
  /** The record's id from the route; undefined on the "new" page. */
  id: () => string | undefined;
  /** Lower-case name of the record in messages, e.g. "fitment". */
  noun: string;
  empty: () => D;
  fromRecord: (record: R) => D;
  check: (draft: D) => Record<string, string>;
  toInput: (draft: D) => I;
  get: (id: string) => Promise<R>;
  create: (body: I) => Promise<R>;
  update: (id: string, body: I) => Promise<R>;
  remove: (id: string) => Promise<unknown>;
  savedToast: (record: R) => ToastMessageOptions;
  deleteMessage: (record: R) => string;
  editRoute: RouteName;
  listRoute: RouteName;
}

/** Load, edit, save and delete-with-confirm for one back-office record, shared by the edit pages. */
export function useEditRecord<R extends { id: string }, D, I>(o: EditRecordOptions<R, D, I>) {
  const router = useRouter();
  const toast = useToast();
  const confirm = useConfirm();
  const Noun = o.noun.charAt(0).toUpperCase() + o.noun.slice(1);

  const draft = ref(o.empty()) as Ref<D>;
  const saved = ref(null) as Ref<R | null>;
  const loading = ref(false);
  const loadError = ref('');
  // Client checks speak only after the first save attempt, so a half-typed form is not covered in red.
  const attempted = ref(false);
  const { busy, error, fields, run } = useSubmit();
  const deleting = ref(false);

  const isNew = computed(() => !o.id());
  const clientErrors = computed(() => (attempted.value ? o.check(draft.value) : {}));
  const errors = computed<Record<string, string>>(() => ({ ...fields.value, ...clientErrors.value }));

  async function load(id: string) {
    loading.value = true;
    loadError.value = '';
    try {
      const r = await o.get(id);
      saved.value = r;
      draft.value = o.fromRecord(r);
    } catch (e) {
      loadError.value = e instanceof ApiError && e.status === 404 ? `There is no such ${o.noun}; it may have been deleted.` : e instanceof ApiError ? e.message : `Could not load the ${o.noun}.`;
    } finally {
      loading.value = false;
    }
  }

  watch(
    o.id,
    (id) => {
      attempted.value = false;
      fields.value = {};
      error.value = '';
      if (id) void load(id);
      else {
        saved.value = null;
        draft.value = o.empty();
      }
    },
    { immediate: true },
  );

  async function save() {
    attempted.value = true;
    if (Object.keys(o.check(draft.value)).length > 0) {
      error.value = 'Some fields need attention; each says what is wrong.';
      fields.value = {};
      return;
    }
    const body = o.toInput(draft.value);
    const id = o.id();
    const result = await run(() => (id ? o.update(id, body) : o.create(body)));
    if (!result) {
      if (Object.keys(fields.value).length > 0) error.value = 'The server refused some fields; each says what is wrong.';
      return;
    }
    saved.value = result;
    draft.value = o.fromRecord(result);
    attempted.value = false;
    toast.add(o.savedToast(result));
    if (!o.id()) await router.replace(to(o.editRoute, { params: { id: result.id } }));
  }

  function askDelete() {
    const r = saved.value;
    if (!r) return;
    confirm.require({
      header: `Delete this ${o.noun}?`,
      message: o.deleteMessage(r),
      acceptProps: { label: 'Delete', severity: 'danger' },
      rejectProps: { label: 'Keep', severity: 'secondary', outlined: true },
      accept: async () => {
        deleting.value = true;
        try {
          await o.remove(r.id);
          toast.add({ severity: 'success', summary: `${Noun} deleted`, life: 3000 });
          await router.push(to(o.listRoute));
        } catch (e) {
          toast.add({ severity: 'error', summary: 'Not deleted', detail: e instanceof ApiError ? e.message : 'Please try again.', life: 6000 });
        } finally {
          deleting.value = false;
        }
      },
    });
  }

  return { draft, saved, loading, loadError, busy, error, deleting, isNew, errors, save, askDelete };
}
