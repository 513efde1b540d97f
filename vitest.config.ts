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

// Every API test file that writes, reads or deletes stored files.
const S3_TESTS = [
  'tests/api/uploads.test.ts',
  'tests/api/upload-bounds.test.ts',
  'tests/api/inspection-refusals.test.ts',
  'tests/api/backup-restore.test.ts',
  'tests/api/releases.test.ts',
  'tests/api/owner-release-signature.test.ts',
  'tests/api/transfers.test.ts',
  'tests/api/publications.test.ts',
  'tests/api/owner-links.test.ts',
  'tests/api/notices.test.ts',
  'tests/api/file-storage.test.ts',
  'tests/api/s3/*.test.ts',
]

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
          // What only a bucket has: the api-s3 project, with the S3 stand-in running.
          // npm run test:pg leaves out the files that are about the embedded engine itself (each says why there);
          // what only a bucket has runs in the api-s3 project, with the S3 stand-in running.
          exclude: ['tests/api/s3/**', ...(testEngineFromEnv() === 'postgres' ? Object.keys(PGLITE_ONLY) : [])],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        // The file tests again with every file in a bucket of the local S3 stand-in (issue 15, "Files").
        resolve: { alias },
        test: {
          name: 'api-s3',
          globalSetup: ['tests/helpers/global-setup.ts', 'tests/helpers/s3-setup.ts'],
          include: S3_TESTS,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
})
