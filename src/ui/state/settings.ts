/**
 * The crew's preferences on this phone (theme, units, tolerance, tilt bias). Preferences are not records: they stay
 * in localStorage on this device and are not part of the logbook backup. Records live in Dexie (src/data).
 */
import { createStore } from './store.ts';

export interface Settings {
  theme: 'outdoor' | 'dark';
  angleFormat: 'decimal' | 'dm';
  lengthUnit: 'm' | 'ft';
  /** Alignment tolerance preset, or custom values below. */
  tolerancePreset: 'calibration' | 'monitoring' | 'custom';
  customToleranceDeg: { azimuthDeg: number; tiltDeg: number; rollDeg: number };
  /** Tilt bias of this phone from the reversal routine, degrees (subtracted from readings). */
  tiltBiasDeg: number;
  tiltBiasMeasuredAtMs: number | null;
  /** Disagreement between azimuth methods that triggers a warning, degrees. */
  methodToleranceDeg: number;
  crewName: string;
  /** Align captures by itself once the plate has been steady within tolerance for a moment (a hands-off hold). */
  autoCapture: boolean;
  safetyAcknowledgedAtMs: number | null;
  /** When the first-run demo offer was answered (loaded or declined), so it is asked once. */
  demoOfferedAtMs: number | null;
}

export const DEFAULT_SETTINGS: Settings = {
  theme: 'outdoor',
  angleFormat: 'decimal',
  lengthUnit: 'm',
  tolerancePreset: 'monitoring',
  customToleranceDeg: { azimuthDeg: 1, tiltDeg: 0.5, rollDeg: 1 },
  tiltBiasDeg: 0,
  tiltBiasMeasuredAtMs: null,
  methodToleranceDeg: 3,
  crewName: '',
  autoCapture: false,
  safetyAcknowledgedAtMs: null,
  demoOfferedAtMs: null,
};

const KEY = 'glintmark.settings.v1';

function load(): Settings {
  try {
    const raw = globalThis.localStorage?.getItem(KEY);
    return raw ? { ...DEFAULT_SETTINGS, ...(JSON.parse(raw) as Partial<Settings>) } : DEFAULT_SETTINGS;
  } catch {
    return DEFAULT_SETTINGS;
  }
}

export const settings = createStore<Settings>(load());

settings.subscribe(() => {
  try {
    globalThis.localStorage?.setItem(KEY, JSON.stringify(settings.get()));
  } catch {
    /* storage full or unavailable: preferences fall back to defaults next start */
  }
});
