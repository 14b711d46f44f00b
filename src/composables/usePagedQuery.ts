import { ref, shallowRef, watch, type Ref } from 'vue';
import type { Page } from '@contracts/paging.js';
import type { Query } from '@/api/client';
import { useNotificationsStore } from '@/stores/notifications';

export interface TableOptions {
  page: number;
  itemsPerPage: number;
  sortBy: Array<{ key: string; order?: 'asc' | 'desc' | boolean }>;
}

/**
 * Server paging for a v-data-table-server: hand it the table's options and it fetches the page,
 * keeping items, total and loading. `filters` re-fetch from page 1 when they change.
 */
export function usePagedQuery<T>(fetchPage: (query: Query) => Promise<Page<T>>, filters: Readonly<Ref<Query>> = ref({})) {
  const items = shallowRef<T[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const options = ref<TableOptions>({ page: 1, itemsPerPage: 25, sortBy: [] });
  const notifications = useNotificationsStore();

  async function load(next: TableOptions = options.value): Promise<void> {
    options.value = next;
    loading.value = true;
    try {
      const sort = next.sortBy[0];
      const page = await fetchPage({
        ...filters.value,
        page: next.page,
        pageSize: next.itemsPerPage,
        sortBy: sort?.key,
        sortDesc: sort ? sort.order === 'desc' : undefined,
      });
      items.value = page.items;
      total.value = page.total;
    } catch (error) {
      notifications.push((error as Error).message, 'error');
    } finally {
      loading.value = false;
    }
  }

  watch(filters, () => void load({ ...options.value, page: 1 }), { deep: true });

  return { items, total, loading, options, load };
}
