/**
 * A vehicle job's screen. Phone: the top view fills the screen with the tools at the bottom and the
 * details in a drawer whose folded strip keeps the verdicts and the planning line in view. Wide:
 * the top view left, details right. Edits go through the plan's edit hook and the one placement
 * write path (hooks/use-placement-writes.ts), as on a site plan.
 */
import { useCallback, useState } from 'react';
import type { PairM } from '@/components/plan/plan-view';
import { EditNotices, ResponsiveWorkspace, dragPlacement, useWorkspaceBase } from '@/components/plan/workspace-base';
import { Notice } from '@/components/ui';
import { useVehicleEvaluation } from '@/hooks/use-vehicle-evaluation';
import type { CatalogueItemDto, MirrorClass, ProjectDto } from '@/shared/schemas';
import { SCENE_LIMITS, LIMIT_MESSAGES } from '@/shared/schemas/limits';
import type { RuleSetId } from '@/shared/vehicle';
import { VehicleCanvas, type VehicleDrag } from './vehicle-canvas';
import { VehicleDetails } from './vehicle-details';
import { VehicleDrawer } from './vehicle-drawer';
import { newVehicleMirrorBody } from './vehicle-mirrors';
import { VehicleToolbar } from './vehicle-toolbar';
import type { PartPlacing } from './vehicle-parts-editor';
import { moveFieldCorner, moveTarget, switchDriveSide } from './vehicle-part-edits';
import type { DriverSide, Vehicle } from '@/shared/schemas/vehicle';

export function VehicleWorkspace({ project, catalogue }: { project: ProjectDto; catalogue: CatalogueItemDto[] }) {
  const { wide, units, edits, header } = useWorkspaceBase(project);
  const evaluation = useVehicleEvaluation(edits.scene, edits.placements, catalogue);
  const canEdit = project.canEdit;
  const [selectedId, setSelectedId] = useState<number | null>(null);
  const [adding, setAdding] = useState(false);
  const [addClass, setAddClass] = useState<MirrorClass>('V');
  const [localProblem, setLocalProblem] = useState<string | null>(null);
  const [drawerOpen, setDrawerOpen] = useState(false);
  const [placing, setPlacing] = useState<PartPlacing>(null);

  const onTapPlan = (pointM: PairM) => {
    setLocalProblem(null);
    const saved = edits.baseScene.vehicle;
    if (placing && saved) {
      const next =
        placing.kind === 'target' ? moveTarget(saved, placing.id, pointM) : moveFieldCorner(saved, placing.id, placing.index, pointM);
      setPlacing(null);
      void edits.saveScene({ ...edits.baseScene, vehicle: next });
      return;
    }
    if (!adding || !evaluation) return;
    if (edits.placements.length >= SCENE_LIMITS.mirrors) return setLocalProblem(LIMIT_MESSAGES.mirrors);
    const body = newVehicleMirrorBody(pointM, addClass, evaluation.geometry, evaluation.fields, edits.placements.length);
    void edits.createPlacement(body).then((created) => {
      if (!created) return;
      setSelectedId(created.id);
      setAdding(false);
    });
  };

  const { setDragPreview, savePlacement } = edits;
  const onDrag = useCallback((d: VehicleDrag) => dragPlacement({ setDragPreview }, savePlacement, d), [setDragPreview, savePlacement]);

  const base = edits.baseScene;
  const onRuleSet = (ruleSet: RuleSetId) => void edits.saveScene({ ...base, ruleSet });
  const onSaveVehicle = (v: Vehicle) => void edits.saveScene({ ...edits.baseScene, vehicle: v });
  // The scene first: the server checks a mirror's served fields against the vehicle it has.
  const onSwitchDriveSide = (side: DriverSide) => {
    const saved = base.vehicle;
    if (!saved || !evaluation || saved.driverSide === side) return;
    const { vehicle: mirrored, patches } = switchDriveSide(saved, evaluation.ruleSet, edits.placements);
    void edits.saveScene({ ...base, vehicle: mirrored }).then((ok) => {
      if (ok) for (const { id, patch } of patches) void savePlacement(id, patch);
    });
  };
  // On a phone the details cover the top view: fold them so the tap can land.
  const onPlacing = (p: PartPlacing) => {
    setPlacing(p);
    setAdding(false);
    if (p) setDrawerOpen(false);
  };
  const deleteMirror = (id: number) => {
    setSelectedId(null);
    void edits.deletePlacement(id);
  };
  // On a phone the drawer stays folded when a mirror is picked: its strip names the mirror and the
  // verdicts, and the top view stays clear for the drag that usually follows.
  const select = (id: number | null) => setSelectedId(id);

  if (!evaluation) {
    return (
      <Notice tone="stop" testID="vehicle-missing">
        This vehicle job has no vehicle in its plan; start a new vehicle job.
      </Notice>
    );
  }

  const placingName =
    placing?.kind === 'target'
      ? `test cylinder “${base.vehicle?.targets.find((t) => t.id === placing.id)?.name ?? ''}”`
      : placing
        ? `corner ${placing.index + 1} of “${base.vehicle?.groundFields.find((f) => f.id === placing.id)?.name ?? ''}”`
        : '';
  const banner = (
    <>
      {placing ? (
        <Notice tone="info" testID="vehicle-placing">
          {`Tap the top view where ${placingName} goes.`}
        </Notice>
      ) : null}
      <EditNotices edits={edits} editorOpenFor={null} toolProblem={localProblem} catalogue={catalogue} units={units} />
    </>
  );

  const details = (
    <VehicleDetails
      projectId={project.id}
      canEdit={canEdit}
      evaluation={evaluation}
      placements={edits.placements}
      selectedId={selectedId}
      units={units}
      onRuleSet={onRuleSet}
      onChangeMirror={(id, patch, autosaveMs) => edits.writes.change(id, patch, autosaveMs)}
      onDeleteMirror={deleteMirror}
      onDeselect={() => setSelectedId(null)}
      onSaveVehicle={onSaveVehicle}
      onSwitchDriveSide={onSwitchDriveSide}
      placing={placing}
      onPlacing={onPlacing}
    />
  );

  const toolbar = (
    <VehicleToolbar
      canEdit={canEdit}
      adding={adding}
      onAdding={(a) => {
        setAdding(a);
        setPlacing(null);
        setLocalProblem(null);
      }}
      addClass={addClass}
      onAddClass={setAddClass}
      canDelete={selectedId !== null}
      onDelete={() => selectedId !== null && deleteMirror(selectedId)}
    />
  );

  const canvas = (
    <VehicleCanvas
      evaluation={evaluation}
      placements={edits.placements}
      units={units}
      adding={adding || placing !== null}
      canEdit={canEdit}
      placing={placing}
      selectedId={selectedId}
      onSelect={select}
      onTapPlan={onTapPlan}
      onDrag={onDrag}
      reserveBottom={adding ? 170 : 80}
    />
  );
  const parts = { title: project.name, header, canvas, overPlan: banner, toolbar };
  return (
    <ResponsiveWorkspace
      {...parts}
      wide={wide}
      details={details}
      drawerOpen={drawerOpen}
      drawer={
        <VehicleDrawer
          open={drawerOpen}
          onToggle={() => setDrawerOpen((o) => !o)}
          evaluation={evaluation}
          selected={edits.placements.find((p) => p.id === selectedId)}
        >
          {details}
        </VehicleDrawer>
      }
    />
  );
}
