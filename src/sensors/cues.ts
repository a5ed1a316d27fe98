/**
 * The "within tolerance" cue: a short vibration (Capacitor Haptics, which uses navigator.vibrate on the web) and a
 * short beep (Web Audio). Both are best-effort: where either is missing or blocked, nothing happens and nothing throws.
 */
import { Haptics, NotificationType } from '@capacitor/haptics';
import type { CueSensor } from './types.ts';

/** The parts of Web Audio used for the beep. */
export interface AudioLike {
  state?: string;
  currentTime: number;
  destination: unknown;
  resume?: () => Promise<void>;
  createOscillator(): { frequency: { value: number }; connect(d: unknown): unknown; start(t?: number): void; stop(t?: number): void };
  createGain(): { gain: { value: number; setValueAtTime?(v: number, t: number): void; exponentialRampToValueAtTime?(v: number, t: number): void }; connect(d: unknown): unknown };
}

export interface CueDeps {
  vibrate: () => Promise<void>;
  /** Creates the audio context on first use (browsers allow sound only after a tap on the page). */
  audio: () => AudioLike | null;
}

/** Beep pitch, Hz, and length, s. */
const BEEP_HZ = 880;
const BEEP_S = 0.15;
const BEEP_GAIN = 0.2;

export function createCues(deps: CueDeps): CueSensor {
  let ctx: AudioLike | null | undefined;
  return {
    withinTolerance(opts = {}) {
      if (opts.haptic !== false) {
        try {
          void deps.vibrate().catch(() => undefined);
        } catch {
          /* no vibration on this platform */
        }
      }
      if (opts.sound !== false) {
        try {
          if (ctx === undefined) ctx = deps.audio();
          if (!ctx) return;
          if (ctx.state === 'suspended') void ctx.resume?.().catch(() => undefined);
          const t = ctx.currentTime;
          const osc = ctx.createOscillator();
          const gain = ctx.createGain();
          osc.frequency.value = BEEP_HZ;
          gain.gain.value = BEEP_GAIN;
          gain.gain.setValueAtTime?.(BEEP_GAIN, t);
          gain.gain.exponentialRampToValueAtTime?.(0.001, t + BEEP_S);
          osc.connect(gain);
          gain.connect(ctx.destination);
          osc.start(t);
          osc.stop(t + BEEP_S);
        } catch {
          /* audio blocked or missing */
        }
      }
    },
  };
}

export function realCues(): CueSensor {
  return createCues({
    vibrate: () => Haptics.notification({ type: NotificationType.Success }),
    audio: () => {
      const g = globalThis as unknown as { AudioContext?: new () => AudioLike; webkitAudioContext?: new () => AudioLike };
      const C = g.AudioContext ?? g.webkitAudioContext;
      try {
        return C ? new C() : null;
      } catch {
        return null;
      }
    },
  });
}
