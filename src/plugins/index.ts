import type { App } from 'vue';
import router from '@/router';
import { installErrorHandler } from './error-handler';
import pinia from './pinia';
import vuetify from './vuetify';

export function registerPlugins(app: App): void {
  app.use(pinia).use(vuetify).use(router);
  installErrorHandler(app);
}
