import type { DataTableFilterEvent, DataTableFilterMeta, DataTableFilterMetaData, DataTablePageEvent, DataTableSortEvent } from 'primevue/datatable';
import { onBeforeUnmount, onMounted, ref, shallowRef, type Ref } from 'vue';
import { ApiError } from '../api/client';

/** One page request as the server understands it: 1-based page, a sort and plain text filters. */
export interface TableQuery {
  page: number;
  pageSize: number;
  sort?: string;
  order?: 'asc' | 'desc';
  filters: Record<string, string>;
}

export interface TablePage<T> {
  items: T[];
  total: number;
}

export interface LazyTableOptions {
  pageSize?: number;
  sortField?: string;
  sortOrder?: 1 | -1;
  /** Column filters shown in the table's filter row (the server decides how to match). */
  filterFields?: string[];
  /** Query parameter of the free-text search box, when the list has one. */
  searchParam?: string;
}

/** State and handlers for a PrimeVue DataTable in lazy mode: the server pages, sorts and filters. */
export function useLazyTable<T>(load: (query: TableQuery) => Promise<TablePage<T>>, options: LazyTableOptions = {}) {
  const items = shallowRef<T[]>([]) as Ref<T[]>;
  const total = ref(0);
  const loading = ref(false);
  const error = ref('');
  const first = ref(0);
  const rows = ref(options.pageSize ?? 20);
  const sortField = ref<string | undefined>(options.sortField);
  const sortOrder = ref<1 | -1 | 0 | null | undefined>(options.sortOrder ?? 1);
  const filters = ref<DataTableFilterMeta>(
    Object.fromEntries((options.filterFields ?? []).map((f) => [f, { value: null, matchMode: 'contains' } satisfies DataTableFilterMetaData])),
  );
  const search = ref('');
  let searchTimer: ReturnType<typeof setTimeout> | undefined;
  // Only the newest request may write the table, so a slow early answer cannot overwrite a later one.
  let generation = 0;

  function query(): TableQuery {
    const textFilters: Record<string, string> = {};
    for (const [field, meta] of Object.entries(filters.value)) {
      const value = typeof meta === 'object' && 'value' in meta ? meta.value : undefined;
      if (value !== null && value !== undefined && String(value).trim() !== '') textFilters[field] = String(value).trim();
    }
    if (options.searchParam && search.value.trim()) textFilters[options.searchParam] = search.value.trim();
    return {
      page: Math.floor(first.value / rows.value) + 1,
      pageSize: rows.value,
      sort: sortField.value,
      order: sortField.value ? (sortOrder.value === -1 ? 'desc' : 'asc') : undefined,
      filters: textFilters,
    };
  }

  async function reload(): Promise<void> {
    const mine = ++generation;
    loading.value = true;
    error.value = '';
    try {
      const page = await load(query());
      if (mine !== generation) return;
      items.value = page.items;
      total.value = page.total;
    } catch (e) {
      if (mine !== generation) return;
      error.value = e instanceof ApiError ? e.message : 'Could not load this list. Please try again.';
      if (!(e instanceof ApiError)) console.error(e);
    } finally {
      if (mine === generation) loading.value = false;
    }
  }

  function onPage(e: DataTablePageEvent) {
    first.value = e.first;
    rows.value = e.rows;
    void reload();
  }

  function onSort(e: DataTableSortEvent) {
    sortField.value = typeof e.sortField === 'string' ? e.sortField : undefined;
    sortOrder.value = e.sortOrder;
    first.value = 0;
    void reload();
  }

  function onFilter(_e: DataTableFilterEvent) {
    first.value = 0;
    void reload();
  }

  /** For the search box: waits for a pause in typing before asking the server. */
  function searchSoon() {
    clearTimeout(searchTimer);
    searchTimer = setTimeout(() => {
      first.value = 0;
      void reload();
    }, 350);
  }

  onMounted(reload);
  onBeforeUnmount(() => clearTimeout(searchTimer));

  return { items, total, loading, error, first, rows, sortField, sortOrder, filters, search, reload, onPage, onSort, onFilter, searchSoon, query };
}

export type LazyTable<T> = ReturnType<typeof useLazyTable<T>>;

/** Appends a table query to a path as the list routes expect it (`?page=&pageSize=&sort=[-]field&<field>=`). */
export function withTableQuery(path: string, q: TableQuery, extra: Record<string, string | null | undefined> = {}): string {
  const params = new URLSearchParams();
  params.set('page', String(q.page));
  params.set('pageSize', String(q.pageSize));
  if (q.sort) params.set('sort', q.order === 'desc' ? `-${q.sort}` : q.sort);
  for (const [k, v] of Object.entries({ ...q.filters, ...extra })) if (v !== undefined && v !== null && v !== '') params.set(k, v);
  return `${path}?${params.toString()}`;
}
