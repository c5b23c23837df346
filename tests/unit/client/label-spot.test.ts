import { describe, expect, it } from 'vitest';
import { labelSpot } from '@/features/editor/label-spot';

// A connection's label sits at the middle of its curve unless a card is there; then it slides
// along the curve to the nearest clear point.
describe('connection label placement', () => {
  const size = { width: 100, height: 30 };
  const path = 'M0,0 C100,0 100,200 200,200';

  it('keeps the middle when nothing is there', () => {
    expect(labelSpot(path, size, [])).toEqual({ x: 100, y: 100 });
  });

  it('moves off a card that covers the middle, onto the curve', () => {
    const card = { x: 60, y: 70, width: 80, height: 60 };
    const p = labelSpot(path, size, [card])!;
    const overlaps =
      p.x + 50 > card.x &&
      p.x - 50 < card.x + card.width &&
      p.y + 15 > card.y &&
      p.y - 15 < card.y + card.height;
    expect(overlaps).toBe(false);
    expect(p).not.toEqual({ x: 100, y: 100 });
  });

  it('falls back to the middle when no point is clear, and refuses a path it cannot read', () => {
    expect(labelSpot(path, size, [{ x: -500, y: -500, width: 1000, height: 1000 }])).toEqual({
      x: 100,
      y: 100,
    });
    expect(labelSpot('M0,0 L10,10', size, [])).toBeNull();
  });
});
