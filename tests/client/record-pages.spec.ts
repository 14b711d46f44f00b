import { flushPromises } from '@vue/test-utils';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createMemoryHistory, createRouter } from 'vue-router';
import { upkeepChecklists } from '../../server/contracts/upkeep-checklists';
import CertificateView from '../../src/views/CertificateView.vue';
import EquipmentDetailView from '../../src/views/EquipmentDetailView.vue';
import UpkeepCheckView from '../../src/views/UpkeepCheckView.vue';
import { mountWithApp } from './mount';

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
const notFound = (what: string) => json(404, { error: { code: 'not_found', message: `${what} not found`, fields: {} } });
const router = () =>
  createRouter({
    history: createMemoryHistory(),
    routes: [
      { path: '/', name: 'home', component: { template: '<div />' } },
      { path: '/equipment', name: 'equipment', component: { template: '<div />' } },
      { path: '/equipment/:id', name: 'equipment-detail', component: { template: '<div />' } },
      { path: '/lab', name: 'lab', component: { template: '<div />' } },
    ],
  });
const settle = async () => {
  await flushPromises();
  await new Promise((resolve) => setTimeout(resolve, 30));
  await flushPromises();
};

describe('a record that is not there', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    document.body.innerHTML = '';
  });

  it.each([
    ['a certificate', CertificateView, 'Certificate'],
    ['a piece of equipment', EquipmentDetailView, 'Equipment'],
  ])('shows the not-found page for %s, not an endless wait', async (_what, view, name) => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => notFound(name)),
    );
    const wrapper = mountWithApp(view, { props: { id: '00000000-0000-4000-8000-000000000000' }, global: { plugins: [router()] } });
    await settle();
    expect(document.body.textContent).toContain('There is nothing at this address');
    wrapper.unmount();
  });
});

describe('the upkeep check', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    document.body.innerHTML = '';
  });

  it("gives a separator the separator's checklist, every item unanswered, and saves nothing until each is answered", async () => {
    const separator = { id: 'e1', siteId: 's1', name: 'OWS-1', kind: 'oil-water-separator', active: true };
    const checklist = upkeepChecklists['oil-water-separator'];
    const fetch = vi.fn(async (url: string, init?: RequestInit) => {
      if (url.startsWith('/api/equipment/')) return json(200, separator);
      if (url.startsWith('/api/upkeep-checks') && init?.method === 'POST') return json(201, { id: 'c1', failedCount: 0 });
      if (url.startsWith('/api/upkeep-checks')) return json(200, { items: [], checklist });
      return json(404, { error: { code: 'not_found', message: 'nothing', fields: {} } });
    });
    vi.stubGlobal('fetch', fetch);
    // jsdom lays nothing out: the form's scroll to the first unanswered item is a no-op here.
    Element.prototype.scrollIntoView = vi.fn();
    const wrapper = mountWithApp(UpkeepCheckView, { props: { id: 'e1' }, global: { plugins: [router()] } });
    await settle();
    expect(document.body.textContent).toContain(checklist[0]!.label);
    expect(document.body.textContent).not.toContain('Wipers or scrapers');

    document.querySelector<HTMLButtonElement>('[data-test="save-upkeep"]')!.click();
    await settle();
    const posts = () => fetch.mock.calls.filter(([, init]) => (init as RequestInit | undefined)?.method === 'POST');
    expect(posts()).toHaveLength(0);
    expect(document.querySelectorAll('[data-test="unanswered"]').length).toBe(checklist.length);

    checklist.forEach((_item, index) => document.querySelector<HTMLButtonElement>(`[data-test="pass-${index}"]`)!.click());
    await settle();
    document.querySelector<HTMLButtonElement>('[data-test="save-upkeep"]')!.click();
    await settle();
    expect(posts()).toHaveLength(1);
    const body = JSON.parse(String((posts()[0]![1] as RequestInit).body));
    expect(body.items.map((item: { key: string; outcome: string }) => [item.key, item.outcome])).toEqual(
      checklist.map((item) => [item.key, 'pass']),
    );
    wrapper.unmount();
  });
});
