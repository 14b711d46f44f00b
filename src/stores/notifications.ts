import { defineStore } from 'pinia';
import { ref } from 'vue';

export interface Notice {
  text: string;
  color: 'success' | 'error' | 'info' | 'warning';
}

/** One queue of short messages for the whole app; field errors stay on their forms instead. */
export const useNotificationsStore = defineStore('notifications', () => {
  const queue = ref<Notice[]>([]);
  function push(text: string, color: Notice['color'] = 'info'): void {
    queue.value.push({ text, color });
  }
  return { queue, push };
});
