/**
 * The vehicle's top view in the site plan's frame (canvas-frame.tsx: viewport, gestures, zoom
 * buttons): pan, pinch, drag a mirror, turn its aim handle, tap to add. The hooks work in
 * the display frame (forward up, vehicle-frame.ts); drags and taps cross back to the vehicle's plan
 * frame here, so everything saved is in the vehicle's own frame.
 */
import { useCallback, useMemo } from 'react';
import type { VehicleEvaluation } from '@/hooks/use-vehicle-evaluation';
import type { PlacementDto, Scene } from '@/shared/schemas';
import type { UnitSystem } from '@/shared/units';
import type { PlanDrag } from '@/components/plan/plan-gesture';
import type { PairM } from '@/components/plan/plan-view';
import { CanvasFrame, usePlanFrame } from '@/components/plan/canvas-frame';
import { azimuthFromDisplay, displayPlacements, fitBounds, fromDisplay } from './vehicle-frame';
import { VehicleDrawing } from './vehicle-drawing';
import type { PartPlacing } from './vehicle-parts-editor';

/** A drag in the vehicle's plan frame. */
export type VehicleDrag =
  { kind: 'move'; id: number; positionM: PairM; done: boolean } | { kind: 'aim'; id: number; azimuthRad: number; done: boolean };

export interface VehicleCanvasProps {
  evaluation: VehicleEvaluation;
  placements: readonly PlacementDto[];
  units: UnitSystem;
  adding: boolean;
  canEdit: boolean;
  selectedId: number | null;
  onSelect: (id: number | null) => void;
  /** A tap while adding a mirror, in the vehicle's plan metres. */
  onTapPlan: (pointM: PairM) => void;
  onDrag: (drag: VehicleDrag) => void;
  reserveBottom?: number;
  /** A cylinder or field corner waiting for a tap (drawn highlighted). */
  placing?: PartPlacing;
}

/** The gesture machine reads walls, zones and viewers from a scene: a vehicle's top view has none. */
const NO_SCENE: Scene = { walls: [], zones: [], viewers: [] };

export function VehicleCanvas(props: VehicleCanvasProps) {
  const { evaluation, placements, units, adding, canEdit, selectedId, reserveBottom = 0 } = props;
  const shown = useMemo(() => displayPlacements(placements), [placements]);
  // The vehicle and its fields: moving a mirror does not change what "fit" shows.
  const targets = evaluation.vehicle.targets;
  const bounds = useMemo(
    () => fitBounds(evaluation.geometry, evaluation.fields, targets),
    [evaluation.geometry, evaluation.fields, targets],
  );
  const { onSelect, onTapPlan, onDrag } = props;
  const handleDrag = useCallback(
    (d: PlanDrag) => {
      if (d.kind === 'placement-move') onDrag({ kind: 'move', id: d.id, positionM: fromDisplay(d.positionM), done: d.done });
      else if (d.kind === 'placement-aim') onDrag({ kind: 'aim', id: d.id, azimuthRad: azimuthFromDisplay(d.azimuthRad), done: d.done });
    },
    [onDrag],
  );
  const frame = usePlanFrame(bounds, reserveBottom, {
    context: {
      scene: NO_SCENE,
      placements: shown,
      selection: selectedId === null ? null : { kind: 'placement', id: selectedId },
      canEdit,
      tool: adding && canEdit ? 'mirror' : 'select',
    },
    onSelect: (s) => onSelect(s?.kind === 'placement' ? s.id : null),
    onTapPlan: (p) => onTapPlan(fromDisplay(p)),
    onDrag: handleDrag,
  });

  const { viewport } = frame;
  return (
    <CanvasFrame
      frame={frame}
      label="Vehicle from above, front up: its ground fields with the share its mirrors show, gaps hatched, the body, the driver's eyes and the mirrors"
      testID="vehicle-frame"
    >
      <VehicleDrawing
        evaluation={evaluation}
        placements={placements}
        selectedId={selectedId}
        canEdit={canEdit}
        units={units}
        view={viewport.view}
        size={viewport.size}
        placing={props.placing ?? null}
      />
    </CanvasFrame>
  );
}
