import type { App } from 'vue';
import { vScrollRegion } from '@/directives/scroll-region';
import router from '@/router';
import { installErrorHandler } from './error-handler';
import pinia from './pinia';
import vuetify from './vuetify';

export function registerPlugins(app: App): void {
  app.use(pinia).use(vuetify).use(router);
  app.directive('scroll-region', vScrollRegion);
  installErrorHandler(app);
}
