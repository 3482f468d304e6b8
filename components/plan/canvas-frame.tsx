/**
 * The frame every plan-like view sits in (the site plan and a vehicle's top view): the viewport
 * (usePlanViewport), one responder for every gesture (usePlanGestures) on the frame, the frame
 * itself with its accessible name, and the zoom buttons. What is drawn inside, and what the
 * gestures mean, stay with each canvas.
 */
import { useRef, type ReactNode, type RefObject } from 'react';
import { StyleSheet, View } from 'react-native';
import { palette } from '@/constants/theme';
import type { Bounds } from './plan-view';
import { usePlanGestures, type GestureTargets, type ResponderHandlers } from './use-plan-gestures';
import { usePlanViewport, type PlanViewport } from './use-plan-viewport';
import { ZoomControls } from './zoom-controls';

/** Zoom buttons step by this factor (in) and its inverse (out). */
const ZOOM_STEP = 1.4;

export interface PlanFrame {
  frameRef: RefObject<View | null>;
  viewport: PlanViewport;
  responder: ResponderHandlers;
}

/** The viewport and the gestures on one frame; `bounds` is what "fit" shows, clear of `reserveTop` and `reserveBottom` pixels. */
export function usePlanFrame(bounds: Bounds | null, reserveBottom: number, targets: GestureTargets, reserveTop = 0): PlanFrame {
  const frameRef = useRef<View>(null);
  const viewport = usePlanViewport(frameRef, bounds, reserveBottom, reserveTop);
  const responder = usePlanGestures(frameRef, viewport.originRef, viewport.viewRef, viewport.setViewByPerson, targets);
  return { frameRef, viewport, responder };
}

export interface CanvasFrameProps {
  frame: PlanFrame;
  /** What a screen reader says for the whole drawing. */
  label: string;
  testID?: string;
  /** The drawing, in the frame's pixels. */
  children: ReactNode;
  /** Over the frame, outside its responder (the keyboard's marker stops). */
  overFrame?: ReactNode;
  /** See ZoomControls: the phone's row this many pixels above the bottom, or the wide stack. */
  zoomAtBottom?: number;
}

export function CanvasFrame({ frame, label, testID, children, overFrame, zoomAtBottom }: CanvasFrameProps) {
  const { frameRef, viewport, responder } = frame;
  return (
    <View style={styles.outer}>
      <View ref={frameRef} style={styles.frame} onLayout={viewport.onLayout} {...responder} role="img" aria-label={label} testID={testID}>
        {children}
      </View>
      {overFrame}
      <ZoomControls
        atBottom={zoomAtBottom}
        onZoomIn={() => viewport.zoomBy(ZOOM_STEP)}
        onZoomOut={() => viewport.zoomBy(1 / ZOOM_STEP)}
        onFit={viewport.fit}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  outer: { flex: 1 },
  frame: { flex: 1, overflow: 'hidden', backgroundColor: palette.card, userSelect: 'none', touchAction: 'none' } as object,
});
