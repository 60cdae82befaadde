import type { PointGroup } from 'signature_pad';

/** The pad's drawing area in CSS pixels, which is the space signature_pad's points live in. */
export type PadSize = { width: number; height: number };

/**
 * How much to scale a drawing made at `drawnAt` so that it fits `now` without being cut off:
 * the same factor both ways (a signature must not be stretched), never enlarged, so turning a
 * phone to landscape and back returns the drawing to its own size.
 */
export function fitFactor(drawnAt: PadSize, now: PadSize): number {
  if (drawnAt.width <= 0 || drawnAt.height <= 0 || now.width <= 0 || now.height <= 0) return 1;
  return Math.min(1, now.width / drawnAt.width, now.height / drawnAt.height);
}

/** The strokes with every point moved by `factor` towards the top-left corner; pen widths kept. */
export function scaleStrokes(strokes: readonly PointGroup[], factor: number): PointGroup[] {
  return strokes.map((stroke) => ({
    ...stroke,
    points: stroke.points.map((point) => ({
      ...point,
      x: point.x * factor,
      y: point.y * factor,
    })),
  }));
}

/**
 * The longest PNG data URL that holds at most `maxBytes` of image: base64 takes four characters
 * for every three bytes, plus the `data:image/png;base64,` prefix.
 */
export function maxDataUrlLength(maxBytes: number): number {
  return Math.ceil((maxBytes * 4) / 3) + 'data:image/png;base64,'.length;
}
