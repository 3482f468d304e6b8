/**
 * Performance marks around one live recompute-and-redraw of the plan, read by bench/plan.bench.ts
 * (never by a pass/fail test). Cheap, and skipped where the runtime has no User Timing API.
 */
export const RECOMPUTE_START = 'plan-recompute-start';
export const REDRAW_END = 'plan-redraw-end';
export const FRAME_MEASURE = 'plan-frame';

const timing = (): Performance | null =>
  typeof performance !== 'undefined' && typeof performance.mark === 'function' && typeof performance.measure === 'function'
    ? performance
    : null;

let open = false;

export function markRecomputeStart(): void {
  const p = timing();
  if (!p) return;
  p.mark(RECOMPUTE_START);
  open = true;
}

/** Called after the plan committed a live frame; measures from the last start mark. */
export function markRedrawEnd(): void {
  const p = timing();
  if (!p || !open) return;
  open = false;
  p.mark(REDRAW_END);
  try {
    p.measure(FRAME_MEASURE, RECOMPUTE_START, REDRAW_END);
  } catch {
    // A cleared start mark only loses one sample.
  }
  // Marks would pile up over a long session; the measures are what the benchmark reads.
  p.clearMarks(RECOMPUTE_START);
  p.clearMarks(REDRAW_END);
  if (p.getEntriesByName(FRAME_MEASURE).length > 2000) p.clearMeasures(FRAME_MEASURE);
}
