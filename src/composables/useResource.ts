import { ref, shallowRef, watch, type Ref, type WatchSource } from 'vue';
import { useNotificationsStore } from '@/stores/notifications';

/**
 * Server data for a page or card: `data`, `loading`, `error` and `reload`. Loads at once and
 * again whenever a source in `watchSources` changes; a failure is kept on `error` and shown in
 * the notice queue, never swallowed.
 */
export function useResource<T>(fetch: () => Promise<T>, watchSources: WatchSource[] = []) {
  const data = shallowRef<T>() as Ref<T | undefined>;
  const loading = ref(false);
  const error = ref<Error | null>(null);
  const notifications = useNotificationsStore();
  let latest = 0;

  async function reload(): Promise<void> {
    const call = ++latest;
    loading.value = true;
    error.value = null;
    try {
      const value = await fetch();
      // A slower, older answer never overwrites a newer one (the site picker changed meanwhile).
      if (call === latest) data.value = value;
    } catch (caught) {
      if (call !== latest) return;
      error.value = caught instanceof Error ? caught : new Error(String(caught));
      notifications.push(error.value.message, 'error');
    } finally {
      if (call === latest) loading.value = false;
    }
  }

  watch(watchSources, () => void reload(), { immediate: true });
  return { data, loading, error, reload };
}
