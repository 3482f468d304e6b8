/**
 * Binds the plan's gesture machine (plan-gesture.ts) to one React Native responder: converts
 * touches to canvas pixels, keeps the gesture between events, throttles moves to one update per
 * animation frame (the last position wins) and applies the machine's effects.
 */
import { useEffect, useLayoutEffect, useRef, type RefObject } from 'react';
import type { GestureResponderEvent, View } from 'react-native';
import { flushFrame } from './flush-frame';
import { markRecomputeStart } from './perf-marks';
import { asDom } from './plan-dom';
import {
  endGesture,
  moveGesture,
  startGesture,
  type Gesture,
  type GestureContext,
  type GestureEffect,
  type PlanDrag,
} from './plan-gesture';
import type { PairM, PlanView } from './plan-view';
import type { PlanSelection } from './plan-types';

export interface GestureTargets {
  /** Everything the machine reads except the view. */
  context: Omit<GestureContext, 'view'>;
  onSelect: (selection: PlanSelection) => void;
  onTapPlan: (pointM: PairM) => void;
  onDrag: (drag: PlanDrag) => void;
}

export interface ResponderHandlers {
  onStartShouldSetResponder: () => boolean;
  onResponderTerminationRequest: () => boolean;
  onResponderGrant: (e: GestureResponderEvent) => void;
  onResponderMove: (e: GestureResponderEvent) => void;
  onResponderRelease: (e: GestureResponderEvent) => void;
  onResponderTerminate: (e: GestureResponderEvent) => void;
}

export function usePlanGestures(
  frameRef: RefObject<View | null>,
  originRef: RefObject<PairM>,
  viewRef: RefObject<PlanView>,
  setViewByPerson: (view: PlanView) => void,
  targets: GestureTargets,
): ResponderHandlers {
  const latest = useRef(targets);
  useLayoutEffect(() => {
    latest.current = targets;
  });
  const gesture = useRef<Gesture | null>(null);
  const frame = useRef<number | null>(null);
  const pending = useRef<GestureEffect[] | null>(null);

  const apply = (effects: GestureEffect[]) => {
    const t = latest.current;
    for (const fx of effects) {
      if (fx.kind === 'view') setViewByPerson(fx.view);
      else if (fx.kind === 'drag') t.onDrag(fx.drag);
      else if (fx.kind === 'select') t.onSelect(fx.selection);
      else t.onTapPlan(fx.pointM);
    }
  };
  /** At most one view or drag update per animation frame; the last position wins. */
  const schedule = (effects: GestureEffect[]) => {
    if (effects.length === 0) return;
    pending.current = effects;
    if (frame.current !== null) return;
    frame.current = requestAnimationFrame(() => {
      frame.current = null;
      const run = pending.current;
      pending.current = null;
      if (run) {
        markRecomputeStart();
        flushFrame(() => apply(run));
      }
    });
  };
  const cancelScheduled = () => {
    if (frame.current !== null) cancelAnimationFrame(frame.current);
    frame.current = null;
    pending.current = null;
  };
  useEffect(() => cancelScheduled, []);

  /** Every finger (or the pointer) in canvas pixels. */
  const pointsOf = (e: GestureResponderEvent): PairM[] => {
    const dom = asDom(frameRef.current);
    const { pageX, pageY, touches } = e.nativeEvent;
    const origin: PairM = dom ? ((r) => [r.left, r.top] as PairM)(dom.getBoundingClientRect()) : originRef.current;
    const fingers = touches && touches.length >= 2 ? touches.map((t) => [t.pageX, t.pageY] as PairM) : [[pageX, pageY] as PairM];
    return fingers.map(([x, y]) => [x - origin[0], y - origin[1]]);
  };
  const contextWith = (view: PlanView): GestureContext => ({ ...latest.current.context, view });

  const onGrant = (e: GestureResponderEvent) => {
    const view = viewRef.current;
    const step = startGesture(contextWith(view), pointsOf(e));
    gesture.current = step.gesture;
    apply(step.effects);
  };
  const onMove = (e: GestureResponderEvent) => {
    const g = gesture.current;
    const view = viewRef.current;
    if (!g) return;
    const step = moveGesture(contextWith(view), g, pointsOf(e));
    gesture.current = step.gesture;
    schedule(step.effects);
  };
  const onEnd = (e: GestureResponderEvent) => {
    const g = gesture.current;
    gesture.current = null;
    const view = viewRef.current;
    if (!g) return;
    const effects = endGesture(contextWith(view), g, pointsOf(e)[0]);
    if (effects.length > 0) cancelScheduled();
    apply(effects);
  };

  return {
    onStartShouldSetResponder: () => true,
    onResponderTerminationRequest: () => false,
    onResponderGrant: onGrant,
    onResponderMove: onMove,
    onResponderRelease: onEnd,
    onResponderTerminate: onEnd,
  };
}
