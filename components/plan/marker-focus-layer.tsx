/**
 * Keyboard and touch stops over the plan's mirrors and viewers: one transparent 44 px button
 * centred on each marker, in the tab order with a visible focus ring, selecting its item on Enter
 * or Space. It takes no pointer events: taps and drags still go to the plan's one gesture
 * responder underneath (whose hit radius is as large), so a drag is never stolen.
 */
import { Pressable, StyleSheet, View } from 'react-native';
import { focusRing, layout } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import type { PlacementDto, Scene } from '@/shared/schemas';
import type { PlanSelection } from './plan-types';
import { toScreen, type PlanView, type Size } from './plan-view';

export interface MarkerStop {
  key: string;
  selection: NonNullable<PlanSelection>;
  name: string;
  x: number;
  y: number;
}

/** The stops for what is on screen, mirrors first (by label), then viewers, in a stable order. */
export function markerStops(scene: Scene, placements: readonly PlacementDto[], view: PlanView, size: Size): MarkerStop[] {
  const half = layout.minTarget / 2;
  const onScreen = (s: MarkerStop) => s.x >= -half && s.y >= -half && s.x <= size.width + half && s.y <= size.height + half;
  const mirrors = [...placements]
    .sort((a, b) => a.label.localeCompare(b.label, undefined, { numeric: true }))
    .map((p): MarkerStop => {
      const [x, y] = toScreen(view, p.positionM);
      return { key: `placement-${p.id}`, selection: { kind: 'placement', id: p.id }, name: `Mirror ${p.label}`, x, y };
    });
  const viewers = scene.viewers.map((v): MarkerStop => {
    const [x, y] = toScreen(view, v.positionM);
    return { key: `viewer-${v.id}`, selection: { kind: 'viewer', id: v.id }, name: `Viewer ${v.name}`, x, y };
  });
  return [...mirrors, ...viewers].filter(onScreen);
}

export function MarkerFocusLayer(p: {
  scene: Scene;
  placements: readonly PlacementDto[];
  view: PlanView;
  size: Size;
  selection: PlanSelection;
  onSelect: (s: PlanSelection) => void;
}) {
  const stops = markerStops(p.scene, p.placements, p.view, p.size);
  return (
    <View style={StyleSheet.absoluteFill} pointerEvents="none">
      {stops.map((s) => (
        <MarkerStopButton
          key={s.key}
          stop={s}
          selected={p.selection?.kind === s.selection.kind && p.selection.id === s.selection.id}
          onSelect={() => p.onSelect(s.selection)}
        />
      ))}
    </View>
  );
}

function MarkerStopButton({ stop, selected, onSelect }: { stop: MarkerStop; selected: boolean; onSelect: () => void }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const half = layout.minTarget / 2;
  return (
    <Pressable
      testID={`marker-stop-${stop.key}`}
      role="button"
      aria-label={stop.name}
      aria-pressed={selected}
      onPress={onSelect}
      onFocus={onFocus}
      onBlur={onBlur}
      style={[styles.stop, { left: stop.x - half, top: stop.y - half }, focusVisible && focusRing]}
    />
  );
}

const styles = StyleSheet.create({
  stop: {
    position: 'absolute',
    width: layout.minTarget,
    height: layout.minTarget,
    borderRadius: layout.minTarget / 2,
    pointerEvents: 'none',
  } as object,
});
