import { mount, type ComponentMountingOptions } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import type { Component } from 'vue';
import vuetify from '../../src/plugins/vuetify';

/** Mounts a component with the app's own Vuetify configuration and a fresh Pinia. */
export function mountWithApp<T extends Component>(component: T, options: ComponentMountingOptions<T> = {}) {
  const pinia = createPinia();
  setActivePinia(pinia);
  return mount(component, {
    ...options,
    global: { ...(options.global ?? {}), plugins: [vuetify, pinia, ...(options.global?.plugins ?? [])] },
    attachTo: document.body,
  } as ComponentMountingOptions<T>);
}
