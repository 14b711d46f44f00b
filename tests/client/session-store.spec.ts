import { createPinia, setActivePinia } from 'pinia';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { nextTick, ref } from 'vue';
import { useRecordSite } from '../../src/composables/useRecordSite';
import { useSessionStore } from '../../src/stores/session';

const me = {
  user: { id: 'u1', email: 'operator@decant.test', name: 'Luis', role: 'operator' },
  sites: [
    {
      id: 's1',
      name: 'A',
      companyName: 'C',
      address: '',
      timeZone: 'America/Chicago',
      retentionYears: 5,
      generatorStatus: 'small',
      manifestRule: 'current',
      oilStorageCapacityGallons: null,
    },
    {
      id: 's2',
      name: 'B',
      companyName: 'C',
      address: '',
      timeZone: 'America/Chicago',
      retentionYears: 5,
      generatorStatus: 'small',
      manifestRule: 'current',
      oilStorageCapacityGallons: null,
    },
  ],
  permissions: [],
};

describe('session store', () => {
  beforeEach(() => {
    setActivePinia(createPinia());
    localStorage.clear();
  });

  it('stays signed out on a 401 instead of throwing', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ error: { code: 'unauthenticated', message: 'Sign in first' } }), { status: 401 })),
    );
    const session = useSessionStore();
    await session.load();
    expect(session.signedIn).toBe(false);
    expect(session.loaded).toBe(true);
  });

  it("answers can() from the shared permission table for the user's role", async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify(me), { status: 200 })),
    );
    const session = useSessionStore();
    await session.load();
    expect(session.can('oil-log.write')).toBe(true);
    expect(session.can('users.manage')).toBe(false);
  });

  it('remembers the chosen site and falls back to the first', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify(me), { status: 200 })),
    );
    const session = useSessionStore();
    await session.load();
    expect(session.currentSite?.id).toBe('s1');
    session.selectSite('s2');
    expect(session.currentSite?.id).toBe('s2');
    expect(localStorage.getItem('decant.site')).toBe('s2');
  });

  it('switches the picker to the site of the record on screen, and ignores a site the user may not see', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify(me), { status: 200 })),
    );
    const session = useSessionStore();
    await session.load();
    const recordSite = ref<string | undefined>(undefined);
    useRecordSite(recordSite);
    expect(session.currentSite?.id).toBe('s1');
    recordSite.value = 's2';
    await nextTick();
    expect(session.currentSite?.id).toBe('s2');
    recordSite.value = 'not-mine';
    await nextTick();
    expect(session.currentSite?.id).toBe('s2');
  });
});
