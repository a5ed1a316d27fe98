/**
 * App lifecycle: when the app goes to the background (the crew pockets the phone, or ends the day) and comes back.
 * On a phone through @capacitor/app; in a browser through the page's visibility. The only module that imports
 * @capacitor/app.
 */
import { App } from '@capacitor/app';
import { Capacitor } from '@capacitor/core';

export const isNativeApp = (): boolean => Capacitor.isNativePlatform();

/** Call `onPause` when the app is backgrounded and `onResume` when it returns. Returns a function that stops. */
export function watchLifecycle(onPause: () => void, onResume: () => void): () => void {
  if (isNativeApp()) {
    const handles = [App.addListener('pause', onPause), App.addListener('resume', onResume)];
    return () => handles.forEach((h) => void h.then((x) => x.remove()));
  }
  const onVisibility = () => (document.visibilityState === 'hidden' ? onPause() : onResume());
  document.addEventListener('visibilitychange', onVisibility);
  return () => document.removeEventListener('visibilitychange', onVisibility);
}
