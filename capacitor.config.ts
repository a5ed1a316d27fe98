import type { CapacitorConfig } from '@capacitor/cli';

/**
 * Never change `server.androidScheme`, `server.hostname` or `server.iosScheme` between releases: the WebView origin
 * would change and the phone's IndexedDB (every logbook record) would appear wiped.
 */
const config: CapacitorConfig = {
  appId: 'app.glintmark.field',
  appName: 'Glintmark',
  webDir: 'dist',
  server: {
    androidScheme: 'https',
    iosScheme: 'capacitor',
    hostname: 'glintmark.local',
  },
};

export default config;
