/** The squares on the selected zone's corners or wall's ends: drag one to reshape (plan-gesture.ts `handle`). */
import { G, Rect } from 'react-native-svg';
import { palette } from '@/constants/theme';
import type { Scene } from '@/shared/schemas';
import { sceneHandles } from './plan-hit-test';
import type { PlanSelection } from './plan-types';
import { toScreen, type PlanView } from './plan-view';

/** Drawn 14 px wide; the finger's reach around it is PICK_PX (24 px), the 48 px target rule halved. */
const HANDLE_PX = 14;

export function SceneHandles({ scene, selection, view }: { scene: Scene; selection: PlanSelection; view: PlanView }) {
  const handles = sceneHandles(scene, selection);
  if (handles.length === 0) return null;
  return (
    <G testID="plan-scene-handles">
      {handles.map(({ handle, atM }) => {
        const [x, y] = toScreen(view, atM);
        const key = handle.kind === 'zone-corner' ? `c${handle.index}` : `e${handle.end}`;
        return (
          <Rect
            key={key}
            testID={handle.kind === 'zone-corner' ? `plan-corner-${handle.index}` : `plan-wall-end-${handle.end}`}
            x={x - HANDLE_PX / 2}
            y={y - HANDLE_PX / 2}
            width={HANDLE_PX}
            height={HANDLE_PX}
            fill={palette.card}
            stroke={palette.asphalt}
            strokeWidth={2}
          />
        );
      })}
    </G>
  );
}
