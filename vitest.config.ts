import { fileURLToPath } from 'node:url'
import VueI18nPlugin from '@intlify/unplugin-vue-i18n/vite'
import vue from '@vitejs/plugin-vue'
import { defineConfig } from 'vitest/config'
import { PGLITE_ONLY, testEngineFromEnv } from './tests/helpers/engine'

const alias = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@db': fileURLToPath(new URL('./db', import.meta.url)),
}

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        plugins: [vue(), VueI18nPlugin({ include: [fileURLToPath(new URL('./src/locales/**', import.meta.url)), fileURLToPath(new URL('./shared/messages/*/*.json', import.meta.url))], compositionOnly: true, strictMessage: false })],
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          setupFiles: ['tests/helpers/i18n-setup.ts'],
          environment: 'node',
          server: { deps: { inline: ['element-plus'] } },
        },
      },
      { resolve: { alias }, test: { name: 'reference', include: ['tests/reference/**/*.test.ts'] } },
      {
        resolve: { alias },
        test: {
          name: 'api',
          globalSetup: ['tests/helpers/global-setup.ts'],
          include: ['tests/api/**/*.test.ts'],
          // npm run test:pg leaves out the files that are about the embedded engine itself (each says why there).
          exclude: testEngineFromEnv() === 'postgres' ? Object.keys(PGLITE_ONLY) : [],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
})
