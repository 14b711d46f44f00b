import vue from '@vitejs/plugin-vue';
import { fileURLToPath } from 'node:url';
import vuetify from 'vite-plugin-vuetify';
import { defineConfig } from 'vitest/config';

const path = (relative: string) => fileURLToPath(new URL(relative, import.meta.url));

export default defineConfig({
  plugins: [vue(), vuetify({ autoImport: true })],
  resolve: {
    alias: { '@': path('./src'), '@contracts': path('./server/contracts') },
  },
  server: {
    host: '127.0.0.1',
    // `npm run dev`: the API runs beside Vite and is reached through this proxy.
    proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 4280}` },
  },
  build: { outDir: 'dist', emptyOutDir: true, chunkSizeWarningLimit: 600 },
  test: {
    // Once per run, before any project: a clean test database, migrated and seeded.
    globalSetup: ['tests/helpers/database-setup.ts'],
    projects: [
      {
        extends: true,
        test: {
          name: 'client',
          environment: 'jsdom',
          include: ['tests/client/**/*.spec.ts'],
          setupFiles: ['tests/client/setup.ts'],
          // Vuetify ships CSS imports inside its JS; Vitest must transform it rather than load it raw.
          server: { deps: { inline: ['vuetify'] } },
        },
      },
      {
        test: {
          name: 'unit',
          environment: 'node',
          include: ['tests/unit/**/*.spec.ts'],
        },
      },
      {
        test: {
          name: 'server',
          environment: 'node',
          include: ['tests/server/**/*.spec.ts', 'tests/idp/**/*.spec.ts'],
          // One test database: files run one after another.
          fileParallelism: false,
          hookTimeout: 60_000,
          testTimeout: 30_000,
        },
      },
      {
        test: {
          name: 'e2e',
          environment: 'node',
          include: ['tests/e2e/**/*.spec.ts'],
          fileParallelism: false,
          hookTimeout: 120_000,
          testTimeout: 120_000,
        },
      },
    ],
  },
});
