import { watch, type Ref } from 'vue';
import { useSessionStore } from '@/stores/session';

/**
 * A page that shows one site's record (opened from a link, say) switches the site picker to
 * that site, so the bar never names one site above another site's figures.
 */
export function useRecordSite(siteId: Ref<string | null | undefined>): void {
  const session = useSessionStore();
  watch(
    siteId,
    (id) => {
      if (id && session.currentSite?.id !== id && session.sites.some((site) => site.id === id)) session.selectSite(id);
    },
    { immediate: true },
  );
}
