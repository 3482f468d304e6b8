/** Names for mirror shapes and dome portions: one copy for the screens and the specification sheet. */
import type { MirrorSpec } from './schemas/catalogue';

type Shape = MirrorSpec['shape'];
type Portion = Extract<MirrorSpec, { shape: 'dome' }>['portion'];

export const SHAPE_LABELS: Record<Shape, string> = { round: 'Round', rect: 'Rectangular', dome: 'Dome' };
export const PORTION_LABELS: Record<Portion, string> = { full: 'Full dome', half: 'Half dome', quarter: 'Quarter dome' };
export const SHAPE_ORDER: readonly Shape[] = ['round', 'rect', 'dome'];

/** The longer name the sheet prints: "Round convex panel", "Half dome". */
export function mirrorKindName(spec: Pick<MirrorSpec, 'shape'> & { portion?: Portion }): string {
  if (spec.shape === 'dome') return spec.portion ? PORTION_LABELS[spec.portion] : SHAPE_LABELS.dome;
  return `${SHAPE_LABELS[spec.shape]} convex panel`;
}
