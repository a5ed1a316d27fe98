import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { offlinePlugin } from './build/offlinePlugin.ts';

// Ionic's nested "sideEffects": false is ignored by Rolldown unless restated here (2.5x larger bundle otherwise).
const ionicComponents = /node_modules[\\/]@ionic[\\/]core[\\/]components[\\/]/;

export default defineConfig({
  plugins: [react(), offlinePlugin()],
  worker: { format: 'es' }, // satellite.js 7 re-exports a WASM worker with top-level await
  build: {
    target: 'es2022',
    rolldownOptions: {
      treeshake: { moduleSideEffects: (id: string) => !ionicComponents.test(id) },
    },
  },
  preview: { host: '127.0.0.1', port: 4173, strictPort: true },
});
