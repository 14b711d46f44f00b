import { flushPromises } from '@vue/test-utils';
import { afterEach, describe, expect, it, vi } from 'vitest';
import PeopleEditDialog from '../../src/components/setup/PeopleEditDialog.vue';
import { mountWithApp } from './mount';

function answer(status: number, body: unknown) {
  return vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } }));
}

describe('PeopleEditDialog', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    document.body.innerHTML = '';
  });

  it("shows the server's field error under the field it names", async () => {
    const fetch = answer(409, {
      error: { code: 'conflict', message: 'A user with this e-mail already exists', fields: { email: 'already registered' } },
    });
    vi.stubGlobal('fetch', fetch);
    const wrapper = mountWithApp(PeopleEditDialog, { props: { modelValue: true, person: null, sites: [] } });
    await flushPromises();
    const [email, name] = wrapper.findAllComponents({ name: 'VTextField' });
    await email!.find('input').setValue('operator@decant.test');
    await name!.find('input').setValue('Twin');
    document.querySelector<HTMLButtonElement>('[data-test="save-person"]')!.click();
    await flushPromises();
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(fetch).toHaveBeenCalledOnce();
    const [url, init] = fetch.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/users');
    expect(JSON.parse(String(init.body))).toMatchObject({ email: 'operator@decant.test', name: 'Twin' });
    expect(document.body.textContent).toContain('already registered');
    expect(wrapper.emitted('saved')).toBeUndefined();
    wrapper.unmount();
  });

  it('does not call the server while a required field is empty', async () => {
    const fetch = answer(201, {});
    vi.stubGlobal('fetch', fetch);
    const wrapper = mountWithApp(PeopleEditDialog, { props: { modelValue: true, person: null, sites: [] } });
    await flushPromises();
    document.querySelector<HTMLButtonElement>('[data-test="save-person"]')!.click();
    await flushPromises();
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(fetch).not.toHaveBeenCalled();
    expect(document.body.textContent).toContain('Required');
    wrapper.unmount();
  });
});
