import type { VAlert, VBtn } from 'vuetify/components';
import type { vScrollRegion } from './directives/scroll-region';

// The named variants registered in plugins/vuetify.ts, typed as the components they alias, and
// the app's own directives registered in plugins/index.ts.
declare module 'vue' {
  export interface GlobalComponents {
    VBtnPrimary: typeof VBtn;
    VAlertNote: typeof VAlert;
  }
  export interface GlobalDirectives {
    vScrollRegion: typeof vScrollRegion;
  }
}
