import { computed, ref, watch, type Ref } from 'vue';
import { dischargePointsApi } from '@/api/discharge-points';
import { parametersApi } from '@/api/parameters';
import { permitsApi } from '@/api/permits';
import { useResource } from './useResource';

/**
 * What the set-up page shows of a site: its discharge points, the parameters it may use, its
 * permits and the chosen permit's limits. The page owns these; its cards get them as props and
 * say when they changed something.
 */
export function useSiteSetup(siteId: Ref<string | undefined>) {
  const points = useResource(async () => (siteId.value ? (await dischargePointsApi.list(siteId.value)).items : []), [siteId]);
  const parameters = useResource(async () => (siteId.value ? (await parametersApi.list(siteId.value)).items : []), [siteId]);
  const permits = useResource(async () => (siteId.value ? (await permitsApi.list(siteId.value)).items : []), [siteId]);
  const permitId = ref<string | null>(null);
  // The first permit is shown until the coordinator picks another, and again if the picked one goes.
  watch(permits.data, (list) => {
    if (!list?.some((permit) => permit.id === permitId.value)) permitId.value = list?.[0]?.id ?? null;
  });
  const permit = computed(() => permits.data.value?.find((candidate) => candidate.id === permitId.value) ?? null);
  const limits = useResource(async () => (permitId.value ? (await permitsApi.limits(permitId.value)).items : []), [permitId]);
  return { points, parameters, permits, permitId, permit, limits };
}
