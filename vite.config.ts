import { defineConfig } from 'vite'
import react from '@vitejs/plugin-react'
import tailwindcss from '@tailwindcss/vite'

// The web app lives in web/; the build lands in dist/web, served by the Express process.
export default defineConfig({
  root: 'web',
  plugins: [react(), tailwindcss()],
  // `@/…` is web/src, `@shared/…` is shared/: the paths of tsconfig.json, the one place they are declared.
  resolve: { tsconfigPaths: true },
  build: { outDir: '../dist/web', emptyOutDir: true, chunkSizeWarningLimit: 600 },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    // `/api` and what is under it, not pages whose address merely starts so (/api-reference)
    proxy: { '^/api(/|$)': `http://127.0.0.1:${process.env.PORT ?? 3000}` },
  },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
})
