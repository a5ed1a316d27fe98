import { describe, expect, it } from 'vitest';
import { createCues, type AudioLike } from '../../src/sensors/cues.ts';

function stubAudio() {
  const log: string[] = [];
  const ctx: AudioLike = {
    state: 'suspended',
    currentTime: 1,
    destination: 'speaker',
    resume: async () => void log.push('resume'),
    createOscillator: () => ({
      frequency: { value: 0 },
      connect: () => log.push('osc.connect'),
      start: (t) => log.push(`start ${t}`),
      stop: (t) => log.push(`stop ${t}`),
    }),
    createGain: () => ({ gain: { value: 0 }, connect: (d) => log.push(`gain→${String(d)}`) }),
  };
  return { ctx, log };
}

describe('cues', () => {
  it('vibrates and beeps once per call, creating the audio context only once', () => {
    const a = stubAudio();
    let vib = 0, made = 0;
    const cues = createCues({ vibrate: async () => void vib++, audio: () => (made++, a.ctx) });
    cues.withinTolerance();
    cues.withinTolerance({ haptic: false });
    expect(vib).toBe(1);
    expect(made).toBe(1);
    expect(a.log.filter((l) => l.startsWith('start')).length).toBe(2);
    expect(a.log).toContain('gain→speaker');
  });

  it('is a silent no-op where vibration and audio are missing or throw', () => {
    const cues = createCues({
      vibrate: () => {
        throw new Error('Browser does not support the vibrate API');
      },
      audio: () => null,
    });
    expect(() => cues.withinTolerance()).not.toThrow();
    const rejecting = createCues({ vibrate: () => Promise.reject(new Error('no')), audio: () => { throw new Error('blocked'); } });
    expect(() => rejecting.withinTolerance()).not.toThrow();
  });
});
