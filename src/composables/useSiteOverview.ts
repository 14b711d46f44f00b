import { computed, type Ref } from 'vue';
import type { FollowUpView } from '@contracts/follow-ups.js';
import type { ResultRow } from '@contracts/lab.js';
import type { PeriodListItem } from '@contracts/periods.js';
import { followUpsApi } from '@/api/follow-ups';
import { labApi } from '@/api/lab';
import { parametersApi } from '@/api/parameters';
import { periodsApi } from '@/api/periods';
import { sitesApi } from '@/api/sites';
import { trailApi } from '@/api/trail';
import { useSessionStore } from '@/stores/session';
import { localDate } from './useSiteToday';
import { useResource } from './useResource';

export interface MonitoringLine {
  key: string;
  label: string;
  taken: number;
  required: number;
}

export interface Attention {
  followUps: FollowUpView[];
  currentPeriod: PeriodListItem | null;
  monitoring: MonitoringLine[];
  /** The latest oil and grease results, with the daily maximum (a concentration) each point is held to. */
  results: ResultRow[];
  dailyMaximumAt: Map<string, string>;
}

/** What the overview shows of one site, each part loaded only for a role that may read it. */
export function useSiteOverview(siteId: Ref<string | undefined>) {
  const session = useSessionStore();
  const site = computed(() => session.sites.find((candidate) => candidate.id === siteId.value));
  const oilOnHand = useResource(
    async () => (site.value && session.can('oil-log.read') ? sitesApi.oilOnHand(site.value.id) : null),
    [siteId],
  );
  const attention = useResource(
    async () => (site.value && session.can('follow-ups.read') ? loadAttention(site.value.id, site.value.timeZone) : null),
    [siteId],
  );
  const recentChanges = useResource(
    async () => (site.value && session.can('trail.read') ? (await trailApi.page({ siteId: site.value.id, pageSize: 6 })).items : null),
    [siteId],
  );

  async function loadAttention(id: string, timeZone: string): Promise<Attention> {
    // The three lists do not depend on each other: asked for at once.
    const [followUpPage, parameters, periods] = await Promise.all([
      followUpsApi.page({ siteId: id, status: 'open', pageSize: 5 }),
      session.can('lab.read') ? parametersApi.list(id) : null,
      session.can('periods.read') ? periodsApi.list(id) : null,
    ]);
    const followUps = followUpPage.items;
    const hem = parameters?.items.find((p) => p.fraction === 'HEM');
    let currentPeriod: PeriodListItem | null = null;
    const monitoring = new Map<string, MonitoringLine>();
    let dailyMaximumAt = new Map<string, string>();
    if (periods) {
      const today = localDate(timeZone);
      currentPeriod = periods.items.find((p) => p.startsOn <= today && p.endsOn >= today) ?? null;
      if (currentPeriod) {
        const summary = await periodsApi.summary(currentPeriod.id);
        for (const row of summary.rows)
          monitoring.set(`${row.pointCode}|${row.parameter}`, {
            key: row.limitId,
            label: `${row.parameter} at ${row.pointCode}`,
            taken: row.samplesTaken,
            required: row.samplesRequired,
          });
        dailyMaximumAt = new Map(
          summary.rows
            .filter((row) => row.parameterId === hem?.id && row.statistic === 'daily-maximum' && !row.unit.endsWith('/day'))
            .map((row) => [row.pointCode, `${row.limitValue} ${row.unit}`]),
        );
      }
    }
    const results = hem
      ? (await labApi.results({ siteId: id, parameterId: hem.id, pageSize: 3, sortBy: 'collectedLocal', sortDesc: true })).items
      : [];
    return { followUps, currentPeriod, monitoring: [...monitoring.values()], results, dailyMaximumAt };
  }

  return { site, oilOnHand, attention, recentChanges };
}
