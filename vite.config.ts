import { fileURLToPath, URL } from 'node:url'
import vue from '@vitejs/plugin-vue'
import Components from 'unplugin-vue-components/vite'
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers'
import { defineConfig } from 'vite'

const apiPort = process.env.PORT ?? '3000'

export default defineConfig({
  plugins: [
    vue(),
    // Element Plus on demand; our own components, composables and stores are imported explicitly.
    Components({ dirs: [], resolvers: [ElementPlusResolver({ importStyle: 'css' })], dts: 'components.d.ts' }),
  ],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  build: { outDir: 'dist/client', emptyOutDir: true, chunkSizeWarningLimit: 800 },
  server: { proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } } },
})
