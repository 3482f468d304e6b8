/** The small plan behind each quick option: the spot, the area to see and the mirror's fan, fitted to a box (pure). */
import type { MultiPolygon, Pair } from '@/shared/geometry/polygon';
import { quickEye, quickMirrorPosition, quickWalls, quickZoneRing, type QuickQuestion } from '@/shared/quick';

export interface SketchFrame {
  width: number;
  height: number;
  /** Plan metres to sketch pixels (y up on the plan, down on the screen). */
  toPx: (p: Pair) => Pair;
}

/** Fits the walls, the area, the viewer and the mirror into `width` × at most `maxHeight` pixels. */
export function sketchFrame(q: QuickQuestion, width: number, maxHeight: number, pad = 10): SketchFrame {
  const pts: Pair[] = [
    ...quickZoneRing(q),
    ...quickWalls(q).flatMap((w) => [w.aM, w.bM]),
    quickMirrorPosition(q),
    [quickEye(q)[0], quickEye(q)[1]],
  ];
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  const s = Math.min((width - 2 * pad) / Math.max(maxX - minX, 1e-6), (maxHeight - 2 * pad) / Math.max(maxY - minY, 1e-6));
  const height = Math.ceil((maxY - minY) * s + 2 * pad);
  return { width, height, toPx: ([x, y]) => [pad + (x - minX) * s, pad + (maxY - y) * s] };
}

export function pathOf(frame: SketchFrame, region: MultiPolygon): string {
  return region
    .flatMap((poly) =>
      poly.map(
        (ring) =>
          ring
            .map((p, i) => {
              const [x, y] = frame.toPx(p);
              return `${i === 0 ? 'M' : 'L'}${x.toFixed(1)},${y.toFixed(1)}`;
            })
            .join('') + 'Z',
      ),
    )
    .join('');
}
