import type { App } from 'vue';
import { useNotificationsStore } from '@/stores/notifications';

/** Nothing fails silently: an error no component handled reaches the notice queue (and the console). */
export function installErrorHandler(app: App): void {
  const report = (error: unknown) => {
    console.error(error);
    useNotificationsStore().push(error instanceof Error ? error.message : 'Something went wrong', 'error');
  };
  app.config.errorHandler = report;
  window.addEventListener('unhandledrejection', (event) => report(event.reason));
}
