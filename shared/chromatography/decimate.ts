/**
 * Decimation for drawing: at most MAX_DISPLAY_POINTS points that keep each
 * interval's lowest and highest value (ml-spectra-processing `xyReduce`), so
 * peak tops and the noise band look as in the full trace. For display only;
 * the processing always uses every point.
 */
import { xyReduce } from 'ml-spectra-processing';

export const MAX_DISPLAY_POINTS = 5000;

export function decimateTrace(
  timeMin: ArrayLike<number>,
  signal: ArrayLike<number>,
  maxPoints = MAX_DISPLAY_POINTS,
): { timeMin: number[]; signal: number[] } {
  if (timeMin.length <= maxPoints)
    return { timeMin: Array.from(timeMin), signal: Array.from(signal) };
  // xyReduce keeps a minimum and a maximum per slot, so ask for half the slots.
  const reduced = xyReduce(
    { x: Array.from(timeMin), y: Array.from(signal) },
    { nbPoints: Math.floor(maxPoints / 2), optimize: true },
  );
  let x = Array.from(reduced.x);
  let y = Array.from(reduced.y);
  if (x.length > maxPoints) {
    const step = x.length / maxPoints;
    const keep = Array.from({ length: maxPoints }, (_, i) => Math.floor(i * step));
    x = keep.map((i) => x[i]);
    y = keep.map((i) => y[i]);
  }
  return { timeMin: x, signal: y };
}
