import type { Directive } from 'vue';

function label(el: HTMLElement, name: string): void {
  const wrapper = el.querySelector<HTMLElement>('.v-table__wrapper') ?? el;
  wrapper.tabIndex = 0;
  wrapper.setAttribute('role', 'region');
  wrapper.setAttribute('aria-label', name);
}

/**
 * A table that scrolls sideways on a phone must be reachable by keyboard (WCAG 2.1 2.1.1): its
 * scrolling wrapper takes focus and is named after the table, `v-scroll-region="'Limits'"`.
 */
export const vScrollRegion: Directive<HTMLElement, string> = {
  mounted: (el, binding) => label(el, binding.value),
  updated: (el, binding) => label(el, binding.value),
};
