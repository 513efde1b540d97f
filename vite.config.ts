import { fileURLToPath, URL } from 'node:url'
import VueI18nPlugin from '@intlify/unplugin-vue-i18n/vite'
import vue from '@vitejs/plugin-vue'
import Components from 'unplugin-vue-components/vite'
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers'
import { defineConfig } from 'vite'
import { compression } from 'vite-plugin-compression2'

const apiPort = process.env.PORT ?? '3000'

export default defineConfig({
  plugins: [
    vue(),
    // The catalogs are compiled to functions at build time; the bundle carries vue-i18n's runtime only.
    VueI18nPlugin({
      include: [fileURLToPath(new URL('./src/locales/**', import.meta.url)), fileURLToPath(new URL('./shared/messages/*/*.json', import.meta.url))],
      runtimeOnly: true,
      compositionOnly: true,
      strictMessage: false,
    }),
    // Element Plus on demand; our own components, composables and stores are imported explicitly.
    Components({ dirs: [], resolvers: [ElementPlusResolver({ importStyle: 'css' })], dts: 'components.d.ts' }),
    // A .br and a .gz beside each text asset, made once at build time; the server picks one per request.
    compression({ include: /\.(html|js|css|json|svg|wasm)$/, algorithms: ['gzip', 'brotliCompress'] }),
  ],
  resolve: {
    alias: [
      { find: '@', replacement: fileURLToPath(new URL('./src', import.meta.url)) },
      { find: '@shared', replacement: fileURLToPath(new URL('./shared', import.meta.url)) },
      // @vue-leaflet imports Leaflet's ES module build, and `import('leaflet')` once (for its
      // global-Leaflet mode), which resolves to the UMD build: point both at one file, one copy.
      { find: /^leaflet$/, replacement: 'leaflet/dist/leaflet-src.esm.js' },
      // vuedraggable's "module" is a UMD bundle that require()s Vue's CommonJS build — a second Vue
      // with the template compiler — and core-js: its own ES source (shipped in the package) imports
      // the one Vue the app uses.
      { find: /^vuedraggable$/, replacement: 'vuedraggable/src/vuedraggable.js' },
    ],
  },
  define: { __INTLIFY_PROD_DEVTOOLS__: false },
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    chunkSizeWarningLimit: 800,
    // One chunk of messages per language (src/i18n/index.ts loads it whole), not one per file; the
    // sign-in page's own namespaces stay in the first download.
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            {
              debugName: 'messages',
              name: (id: string) => `messages-${/\/(?:src\/locales|shared\/messages)\/([a-z]{2})\//.exec(id)?.[1]}`,
              test: /\/(?:src\/locales\/[a-z]{2}\/(?!common\.json|sign-in\.json)|shared\/messages\/[a-z]{2}\/)/,
            },
          ],
        },
      },
    },
  },
  server: { proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } } },
})
