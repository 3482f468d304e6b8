/**
 * Numbered markers for pinned comment threads, drawn inside the plan's SVG (screen pixels for the
 * current view). Open threads are amber with a dark ring, resolved ones grey; nothing here takes
 * pointer events, so the plan's gestures work through them.
 */
import { Circle, G, Text as SvgText } from 'react-native-svg';
import { fonts, palette } from '@/constants/theme';
import type { PlacementDto } from '@/shared/schemas';
import { toScreen, type PlanView } from '@/components/plan/plan-view';
import { pinPointM, type CommentThread } from './comment-threads';

/** A marker sits up and to the right of what it is pinned to, so a mirror's own marker stays visible. */
export const COMMENT_MARKER_OFFSET_PX = { dx: 16, dy: -16 } as const;
const R = 11;

export function CommentMarkers({
  threads,
  placements,
  view,
  pendingPointM = null,
}: {
  threads: readonly CommentThread[];
  placements: readonly Pick<PlacementDto, 'id' | 'positionM'>[];
  view: PlanView;
  /** The point chosen for a comment not yet posted: a dashed ring. */
  pendingPointM?: readonly [number, number] | null;
}) {
  const pending = pendingPointM ? toScreen(view, pendingPointM) : null;
  return (
    <G pointerEvents="none" testID="comment-markers">
      {pending ? (
        <Circle
          testID="comment-marker-pending"
          cx={pending[0]}
          cy={pending[1]}
          r={R}
          fill="none"
          stroke={palette.asphalt}
          strokeWidth={2}
          strokeDasharray="4 3"
        />
      ) : null}
      {threads.map((t) => {
        const at = pinPointM(t.root.pin, placements);
        if (!at) return null;
        const [sx, sy] = toScreen(view, at);
        const x = sx + COMMENT_MARKER_OFFSET_PX.dx;
        const y = sy + COMMENT_MARKER_OFFSET_PX.dy;
        const open = !t.root.resolved;
        return (
          <G key={t.root.id} testID={`comment-marker-${t.number}`}>
            {t.root.pin.kind === 'point' ? <Circle cx={sx} cy={sy} r={3} fill={palette.asphalt} /> : null}
            <Circle
              cx={x}
              cy={y}
              r={R}
              fill={open ? palette.beacon : palette.ruleSoft}
              stroke={open ? palette.asphalt : palette.haze}
              strokeWidth={2}
            />
            <SvgText x={x} y={y + 4.5} textAnchor="middle" fontFamily={fonts.bold} fontSize={13} fill={palette.asphalt}>
              {String(t.number)}
            </SvgText>
          </G>
        );
      })}
    </G>
  );
}
