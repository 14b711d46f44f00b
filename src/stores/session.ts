import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { can as roleCan, type Action } from '@contracts/permissions.js';
import type { Me } from '@contracts/users.js';
import { ApiError } from '@/api/client';
import { sessionApi } from '@/api/session';

/** Who is signed in, what they may do, and which site they are looking at. */
export const useSessionStore = defineStore('session', () => {
  const me = ref<Me | null>(null);
  const loaded = ref(false);
  const selectedSiteId = ref<string | null>(localStorage.getItem('decant.site'));

  const signedIn = computed(() => me.value !== null);
  const role = computed(() => me.value?.user.role ?? null);
  const sites = computed(() => me.value?.sites ?? []);
  const currentSite = computed(() => sites.value.find((site) => site.id === selectedSiteId.value) ?? sites.value[0] ?? null);

  /** Loads /api/me once; a 401 leaves the store signed out rather than throwing. */
  async function load(force = false): Promise<void> {
    if (loaded.value && !force) return;
    try {
      me.value = await sessionApi.me();
    } catch (error) {
      if (!(error instanceof ApiError && error.status === 401)) throw error;
      me.value = null;
    }
    loaded.value = true;
  }

  function can(action: Action): boolean {
    return roleCan(role.value, action);
  }

  function selectSite(id: string): void {
    selectedSiteId.value = id;
    localStorage.setItem('decant.site', id);
  }

  /** Ends Decant's session, then the identity provider's. */
  async function signOut(): Promise<void> {
    const { redirectTo } = await sessionApi.signOut();
    me.value = null;
    window.location.assign(redirectTo);
  }

  /** Saves the user's unit choice on the server, so it follows them to every device. */
  async function setUnitSystem(unitSystem: 'us' | 'metric'): Promise<void> {
    await sessionApi.setUnitSystem(unitSystem);
    if (me.value) me.value = { ...me.value, user: { ...me.value.user, unitSystem } };
  }

  function forget(): void {
    me.value = null;
  }

  return { me, loaded, signedIn, role, sites, currentSite, load, can, selectSite, signOut, setUnitSystem, forget };
});
