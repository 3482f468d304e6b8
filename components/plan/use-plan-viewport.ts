/**
 * The plan's viewport on screen: its measured size, the current view (scale and offsets), fitting
 * the plan on first layout, wheel zoom on the web, the zoom buttons, and publishing the transform
 * on the canvas for browser tests. Once the person pans or zooms, a new size keeps their view.
 */
import { useCallback, useEffect, useLayoutEffect, useRef, useState, type RefObject } from 'react';
import { useWindowDimensions, type LayoutChangeEvent, type View } from 'react-native';
import { asDom } from './plan-dom';
import { centreOn, fitView, formatTransform, zoomAt, type Bounds, type PairM, type PlanView, type Size } from './plan-view';

export interface PlanViewport {
  size: Size;
  view: PlanView;
  /** The latest view, for gesture handlers that outlive a render. */
  viewRef: RefObject<PlanView>;
  /** Where the frame sits in the window (native only; the web measures the element). */
  originRef: RefObject<PairM>;
  onLayout: (e: LayoutChangeEvent) => void;
  /** A view the person chose (pan, pinch, wheel): later size changes keep it. */
  setViewByPerson: (view: PlanView) => void;
  zoomBy: (k: number) => void;
  fit: () => void;
  /** Keeps the scale and moves a plan point to the middle of the frame as it is now. */
  centre: (pointM: PairM) => void;
  /** Fits now and again when the frame next changes size (a drawer folding), unless the person moves the view first. */
  fitAndFollow: () => void;
}

const FIT_MARGIN_PX = 28;

export function usePlanViewport(
  frameRef: RefObject<View | null>,
  bounds: Bounds | null,
  reserveBottom: number,
  reserveTop = 0,
): PlanViewport {
  const windowSize = useWindowDimensions();
  // Until the first layout arrives (and where none ever does, as in tests), guess the window's size.
  const [size, setSize] = useState<Size>(() => ({ width: windowSize.width, height: Math.max(200, windowSize.height - 200) }));
  const [view, setView] = useState<PlanView>(() => fitView(bounds, size, FIT_MARGIN_PX, reserveBottom, reserveTop));
  const measured = useRef(false);
  const touched = useRef(false);
  const viewRef = useRef<PlanView>(view);
  const originRef = useRef<PairM>([0, 0]);
  const fitInputs = useRef({ bounds, reserveBottom, reserveTop });
  const refitOnResize = useRef(false);

  useLayoutEffect(() => {
    viewRef.current = view;
    fitInputs.current = { bounds, reserveBottom, reserveTop };
  });

  const fit = useCallback(
    () => setView(fitView(bounds, size, FIT_MARGIN_PX, reserveBottom, reserveTop)),
    [bounds, size, reserveBottom, reserveTop],
  );
  const fitAndFollow = useCallback(() => {
    refitOnResize.current = true;
    fit();
  }, [fit]);

  const onLayout = useCallback(
    (e: LayoutChangeEvent) => {
      const { width, height } = e.nativeEvent.layout;
      setSize((old) => (old.width === width && old.height === height ? old : { width, height }));
      // The first real size refits the plan unless the person has already moved it; so does the next
      // size after `fitAndFollow` (the phone's drawer folding as calibration starts).
      const first = !measured.current && !touched.current;
      if (first || refitOnResize.current) {
        measured.current = true;
        if (!first) refitOnResize.current = false;
        const f = fitInputs.current;
        setView(fitView(f.bounds, { width, height }, FIT_MARGIN_PX, f.reserveBottom, f.reserveTop));
      }
      frameRef.current?.measureInWindow((x, y) => {
        originRef.current = [x, y];
      });
    },
    [frameRef],
  );

  const setViewByPerson = useCallback((next: PlanView) => {
    touched.current = true;
    refitOnResize.current = false;
    setView(next);
  }, []);

  const zoomBy = useCallback(
    (k: number) => setViewByPerson(zoomAt(viewRef.current, k, size.width / 2, (size.height - reserveBottom) / 2)),
    [setViewByPerson, size, reserveBottom],
  );

  // Publish the view on the web so browser tests can click at plan coordinates.
  useLayoutEffect(() => {
    const dom = asDom(frameRef.current);
    if (!dom) return;
    const t = formatTransform(view);
    dom.setAttribute('data-transform', t);
    dom.querySelector('svg')?.setAttribute('data-transform', t);
  }, [frameRef, view]);

  // Mouse wheel zooms about the pointer (web only; pinch covers touch screens).
  useEffect(() => {
    const dom = asDom(frameRef.current);
    if (!dom) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const rect = dom.getBoundingClientRect();
      setViewByPerson(zoomAt(viewRef.current, Math.exp(-e.deltaY * 0.0015), e.clientX - rect.left, e.clientY - rect.top));
    };
    dom.addEventListener('wheel', onWheel, { passive: false });
    return () => dom.removeEventListener('wheel', onWheel);
  }, [frameRef, setViewByPerson]);

  const centre = useCallback((pointM: PairM) => setView((v) => centreOn(v, size, pointM)), [size]);

  return { size, view, viewRef, originRef, onLayout, setViewByPerson, zoomBy, fit, centre, fitAndFollow };
}
