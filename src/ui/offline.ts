/**
 * Register the service worker of the web build so the app starts with the network off after one visit.
 * Native builds bundle everything and skip it; the dev server has no sw.js.
 */
export function registerOfflineCache(): void {
  const native = (globalThis as { Capacitor?: { isNativePlatform?: () => boolean } }).Capacitor?.isNativePlatform?.() ?? false;
  if (!import.meta.env.PROD || native || !('serviceWorker' in navigator)) return;
  window.addEventListener('load', () => {
    navigator.serviceWorker.register('/sw.js').catch(() => {
      /* the app still works online; the Settings screen reports the cache state */
    });
  });
}
