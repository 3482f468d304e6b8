/**
 * The plan's tool state: which tool taps use, the sketch (the shape being drawn), the kind of wall,
 * the zone outline waiting for its name, and the tool's own sentence. Taps are decided by the pure
 * functions in plan-tool-taps.ts; this hook only holds the state and sends the changes.
 */
import { useState } from 'react';
import type { CatalogueItemDto, CreatePlacementBody, PlacementDto, Scene, SceneWall } from '@/shared/schemas';
import { newSceneId } from './plan-edits';
import { finishZoneSketch, tapWithTool } from './plan-tool-taps';
import type { PlanSelection, PlanTool } from './plan-types';
import type { PairM } from './plan-view';
import { addZone } from './scene-edits';
import type { NewZoneTarget } from './zone-name-prompt';

export interface PlanToolDeps {
  /** The scene without a drag in progress. */
  baseScene: Scene;
  mirrorCount: number;
  catalogue: readonly CatalogueItemDto[];
  saveScene: (next: Scene) => Promise<unknown>;
  createPlacement: (body: CreatePlacementBody) => Promise<PlacementDto | null>;
  select: (s: PlanSelection) => void;
  /** Called once a mirror placed by a tap exists (the phone opens its drawer). */
  onMirrorPlaced: (created: PlacementDto) => void;
}

export function usePlanTool(deps: PlanToolDeps) {
  const [tool, setToolState] = useState<PlanTool>('select');
  const [sketch, setSketch] = useState<readonly PairM[]>([]);
  const [wallKind, setWallKind] = useState<SceneWall['kind']>('wall');
  const [zoneToName, setZoneToName] = useState<PairM[] | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  /** Choosing a tool drops any sketch and the last tool sentence. */
  const setTool = (t: PlanTool) => {
    setToolState(t);
    setSketch([]);
    setProblem(null);
  };

  const tap = (pointM: PairM) => {
    const out = tapWithTool(
      { tool, wallKind, sketch, scene: deps.baseScene, mirrorCount: deps.mirrorCount, catalogue: deps.catalogue, newId: newSceneId },
      pointM,
    );
    setSketch(out.sketch);
    setProblem(out.problem);
    if (out.scene) {
      const { next, select, backToSelect } = out.scene;
      void deps.saveScene(next);
      if (select !== undefined) deps.select(select);
      if (backToSelect) setToolState('select');
    }
    if (out.mirror) {
      void deps.createPlacement(out.mirror).then((created) => {
        if (!created) return;
        deps.select({ kind: 'placement', id: created.id });
        setToolState('select');
        deps.onMirrorPlaced(created);
      });
    }
  };

  const finishZone = () => {
    const out = finishZoneSketch(sketch);
    if (!out) return;
    if ('problem' in out) setProblem(out.problem);
    else setZoneToName(out.outline);
  };

  const nameZone = (name: string, target: NewZoneTarget) => {
    if (!zoneToName) return;
    const id = newSceneId('z');
    void deps.saveScene(addZone(deps.baseScene, { id, name, polygonM: zoneToName, target: { kind: target } }));
    setZoneToName(null);
    setSketch([]);
    deps.select({ kind: 'zone', id });
    setToolState('select');
  };

  return {
    tool,
    setTool,
    wallKind,
    setWallKind,
    sketch,
    cancelSketch: () => setSketch([]),
    /** A finished zone outline waiting for its name, or null. */
    zoneToName,
    cancelZoneName: () => setZoneToName(null),
    tap,
    finishZone,
    nameZone,
    problem,
  };
}

export type PlanToolState = ReturnType<typeof usePlanTool>;
