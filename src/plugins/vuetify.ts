import '@fontsource/noto-sans/latin-400.css';
import '@fontsource/noto-sans/latin-600.css';
import '@fontsource/noto-sans/latin-700.css';
import 'vuetify/styles';
import { createVuetify, type ThemeDefinition } from 'vuetify';
import { VAlert, VBtn } from 'vuetify/components';
import { aliases, mdi } from 'vuetify/iconsets/mdi-svg';

// Water and oil: deep teal for the water, warm amber for the oil, paper for the page.
const decantLight: ThemeDefinition = {
  dark: false,
  colors: {
    background: '#F6F3EC',
    surface: '#FFFDF8',
    'surface-variant': '#E7E1D3',
    'on-surface-variant': '#2A3A42',
    primary: '#0E5E6F',
    secondary: '#3F6B73',
    accent: '#E0A23B',
    error: '#B4441F',
    warning: '#A8680F',
    success: '#2E7D5B',
    info: '#2F6F9F',
  },
  // Secondary text (subtitles, field labels) dark enough for 4.5:1 on the paper surface (WCAG 2.1 1.4.3).
  variables: { 'medium-emphasis-opacity': 0.72 },
};

const decantDark: ThemeDefinition = {
  dark: true,
  colors: {
    background: '#0F1A22',
    surface: '#16242E',
    'surface-variant': '#24343F',
    'on-surface-variant': '#D6E1E4',
    primary: '#5BB8C8',
    secondary: '#8FB5BB',
    accent: '#F0B55A',
    error: '#F08A6B',
    warning: '#F0B55A',
    success: '#6FC79B',
    info: '#7DB6E0',
  },
};

export default createVuetify({
  theme: { defaultTheme: 'decantLight', themes: { decantLight, decantDark } },
  icons: { defaultSet: 'mdi', aliases, sets: { mdi } },
  // Named variants used across screens: the one filled button that does a form's main action,
  // and the quiet inline note (hazards, locks, cautions).
  aliases: { VBtnPrimary: VBtn, VAlertNote: VAlert },
  // Dense, calm defaults once here, so templates do not repeat props.
  defaults: {
    VTextField: { variant: 'outlined', density: 'comfortable', color: 'primary' },
    VSelect: { variant: 'outlined', density: 'comfortable', color: 'primary' },
    VAutocomplete: { variant: 'outlined', density: 'comfortable', color: 'primary' },
    VCombobox: { variant: 'outlined', density: 'comfortable', color: 'primary' },
    VBtn: { rounded: 'lg' },
    VCard: { rounded: 'lg', elevation: 0, border: true },
    // Lists open at 25 rows, one of the page sizes they offer, and say plainly when nothing matches.
    VDataTableServer: { density: 'compact', hover: true, itemsPerPage: 25, noDataText: 'Nothing here for this site and these filters.' },
    VChip: { size: 'small', rounded: 'lg' },
    VBtnPrimary: { color: 'primary', variant: 'flat', rounded: 'lg' },
    VAlertNote: { variant: 'tonal', density: 'compact' },
  },
});
