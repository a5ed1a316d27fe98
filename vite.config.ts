import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { VitePWA } from 'vite-plugin-pwa';

// Ionic's nested "sideEffects": false is ignored by Rolldown unless restated here (2.5x larger bundle otherwise).
const ionicComponents = /node_modules[\\/]@ionic[\\/]core[\\/]components[\\/]/;

export default defineConfig({
  plugins: [
    react(),
    // Offline web app (Workbox): every built file is precached. 'prompt': a new version installs in the background
    // and waits; the app says so and switches only when the crew accepts (src/ui/update.ts). Until then the open
    // page keeps being served the old version's files from the precache.
    VitePWA({
      registerType: 'prompt',
      injectRegister: false,
      manifest: false, // public/manifest.webmanifest is the manifest
      includeAssets: ['icon.svg', '*.png', 'manifest.webmanifest'],
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest,wasm}'],
        // A file too large to precache must fail the build rather than leave a hole in the offline app.
        maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
        navigateFallback: 'index.html',
        cleanupOutdatedCaches: true,
        clientsClaim: false,
        skipWaiting: false,
      },
    }),
  ],
  worker: { format: 'es' }, // satellite.js 7 re-exports a WASM worker with top-level await
  build: {
    target: 'es2022',
    rolldownOptions: {
      treeshake: { moduleSideEffects: (id: string) => !ionicComponents.test(id) },
    },
  },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
});
