import type { VAlert, VBtn } from 'vuetify/components';

// The named variants registered in plugins/vuetify.ts, typed as the components they alias.
declare module 'vue' {
  export interface GlobalComponents {
    VBtnPrimary: typeof VBtn;
    VAlertNote: typeof VAlert;
  }
}
