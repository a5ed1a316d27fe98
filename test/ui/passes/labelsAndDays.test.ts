import { describe, expect, it } from 'vitest';
import { nowAnchor, placeLabels, timelineLayout } from '../../../src/ui/pages/passes/plotLayout.ts';

const overlap = (a: { x: number; y: number; w: number; h: number }, b: typeof a) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

describe('sky-plot labels', () => {
  it('never overlap each other or a mark, even for tracks bunched together', () => {
    const pts = [
      { x: 100, y: 100 },
      { x: 104, y: 102 },
      { x: 98, y: 106 },
      { x: 110, y: 100 },
      { x: 200, y: 50 },
    ];
    const boxes = placeLabels(pts, 26, 14, 6);
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) expect(overlap(boxes[i], boxes[j]), `${i} vs ${j}`).toBe(false);
      for (const p of pts) expect(overlap(boxes[i], { x: p.x - 6, y: p.y - 6, w: 12, h: 12 })).toBe(false);
    }
  });
});

describe('timeline', () => {
  it('keeps the "now" label inside the plot at either end', () => {
    expect(nowAnchor(97, 96, 350)).toBe('start');
    expect(nowAnchor(345, 96, 350)).toBe('end');
    expect(nowAnchor(200, 96, 350)).toBe('middle');
  });
  it('ticks the site’s midnights: Los Angeles midnight is 08:00 UTC in December (UTC−8, tzdata)', () => {
    const start = Date.UTC(2026, 11, 1, 0, 0);
    const l = timelineLayout([], start, 3, undefined, 'America/Los_Angeles');
    const msAt = (x: number) => start + ((x - l.plotLeft) / (l.plotRight - l.plotLeft)) * 3 * 86_400_000;
    const ticks = l.ticks.map((t) => Math.round(msAt(t.x) / 60_000) * 60_000);
    expect(ticks).toEqual([Date.UTC(2026, 11, 1, 8), Date.UTC(2026, 11, 2, 8), Date.UTC(2026, 11, 3, 8)]);
    expect(l.ticks[0].label).toBe('1 Dec');
  });
});
