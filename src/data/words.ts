/** Record values as the screens name them, shared by the screens and the exports (so a file reads like the app). */
import type { AzimuthMethod } from './types.ts';

export const AZIMUTH_METHOD_LABELS: Record<AzimuthMethod, string> = {
  'sun-shadow': 'sun shadow',
  'reference-bearing': 'reference bearing',
  compass: 'compass (with declination)',
  'other-instrument': 'other instrument',
};
