/** A card's box on the canvas, in flow coordinates [px]. */
export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Where along a connection its label is tried, from the middle outwards. */
const TRIES = [0.5, 0.42, 0.58, 0.34, 0.66, 0.26, 0.74, 0.18, 0.82];

/**
 * The point of a connection's label: the middle of its curve, or, when a label of `size` there
 * would sit over a card, the nearest point along the curve where it sits over none (the middle
 * when there is none). `path` is the cubic Bézier the edge draws ("M x,y C x,y x,y x,y").
 */
export function labelSpot(
  path: string,
  size: { width: number; height: number },
  cards: readonly Box[],
  margin = 4,
): { x: number; y: number } | null {
  const n = path.match(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g)?.map(Number) ?? [];
  if (n.length !== 8) return null;
  const [x0, y0, x1, y1, x2, y2, x3, y3] = n;
  const at = (t: number) => {
    const u = 1 - t;
    const a = u * u * u;
    const b = 3 * u * u * t;
    const c = 3 * u * t * t;
    const d = t * t * t;
    return { x: a * x0 + b * x1 + c * x2 + d * x3, y: a * y0 + b * y1 + c * y2 + d * y3 };
  };
  const clear = (p: { x: number; y: number }) =>
    cards.every(
      (r) =>
        p.x + size.width / 2 + margin <= r.x ||
        p.x - size.width / 2 - margin >= r.x + r.width ||
        p.y + size.height / 2 + margin <= r.y ||
        p.y - size.height / 2 - margin >= r.y + r.height,
    );
  for (const t of TRIES) {
    const p = at(t);
    if (clear(p)) return p;
  }
  return at(0.5);
}
