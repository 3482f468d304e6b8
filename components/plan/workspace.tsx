/**
 * The project's live plan and its details, put together: the plan's edits (usePlanEdits), the tool
 * state (usePlanTool), the evaluation, and the selection, arranged by WideWorkspace or PhoneWorkspace.
 * Scene changes are the pure functions of scene-edits.ts.
 */
import { useCallback, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { View } from 'react-native';
import { usePlanHistory } from '@/hooks/use-plan-history';
import { usePlanEvaluation } from '@/hooks/use-plan-evaluation';
import type { CatalogueItemDto, CriteriaSettings, CriterionKind, PlacementDto, ProjectDto, Scene } from '@/shared/schemas';
import { AimAtZoneAction } from './aim-at-zone-action';
import { PlanCanvas, type PlanDrag } from './plan-canvas';
import { PlanDetails } from './plan-details';
import { PlanDrawer, type DrawerSize } from './plan-drawer';
import { roundM } from './plan-edits';
import { PlanToolbar } from './plan-toolbar';
import type { PlanSelection } from './plan-types';
import type { PairM } from './plan-view';
import { moveViewer, removeSceneItem, sceneProblem, setCriteria, setViewerEyeHeight, setZoneCriterion } from './scene-edits';
import { SceneItemEditor } from './scene-item-editor';
import { UndoControls, useUndoKeys } from './undo-controls';
import { usePlanKeys } from './use-plan-keys';
import { usePlanTool } from './use-plan-tool';
import { EditNotices, ResponsiveWorkspace, dragPlacement, useWorkspaceBase } from './workspace-base';
import { ZoneNamePrompt } from './zone-name-prompt';
import { useReviewPlan } from '@/components/review/use-review-plan';
import { AppText } from '@/components/ui';
import { CAUTION_SENTENCES } from '@/shared/cautions';
import { fileAddress, useAddFileToCache, useDeleteFileMutation, useProjectFilesQuery } from '@/hooks/use-files';
import type { FileDto, Underlay } from '@/shared/schemas/files';
import type { UnderlayImage } from './plan-drawing';
import { CalibrationMarks, CalibrationPrompt } from './underlay-calibration';
import { setUnderlay } from './underlay-edits';
import { UnderlayPanel, underlayForUpload } from './underlay-panel';
import { calibrationFrom, useUnderlayCalibration } from './use-underlay-calibration';

/** About the calibration card's height over the plan: a fit while calibrating keeps the plan below it. */
const CALIBRATION_CARD_PX = 150;

export function Workspace({ project, catalogue }: { project: ProjectDto; catalogue: CatalogueItemDto[] }) {
  const { wide, units, edits, header } = useWorkspaceBase(project);
  const [selection, setSelection] = useState<PlanSelection>(null);
  const [drawerSize, setDrawerSize] = useState<DrawerSize>('folded');
  // The floating tools' height on a phone: it grows with a drawing tool's own sentence and choices.
  const [toolbarHeight, setToolbarHeight] = useState(90);
  const selectedPlacementId = selection?.kind === 'placement' ? selection.id : null;
  const evaluation = usePlanEvaluation(edits.scene, edits.placements, catalogue, selectedPlacementId);
  const canEdit = project.canEdit;
  const base = edits.baseScene;
  // Every plan edit below goes through the history, which records it and then saves it as before.
  const history = usePlanHistory({
    baseScene: base,
    // Without the live drag: a drag's end records the values from before it.
    placements: edits.writes.placements,
    saveScene: edits.saveScene,
    savePlacement: edits.savePlacement,
    changePlacement: edits.writes.change,
    removePlacement: edits.writes.remove,
    createPlacement: edits.createPlacement,
    deletePlacement: edits.deletePlacement,
  });
  // The mirror editor types and removes through the history too, so both can be undone.
  const { typePlacement, removeFromEditor } = history;
  const editorWrites = useMemo(
    () => ({ ...edits.writes, change: typePlacement, remove: removeFromEditor }),
    [edits.writes, typePlacement, removeFromEditor],
  );
  useUndoKeys(wide && canEdit, history.undo, history.redo);
  const [editProblem, setEditProblem] = useState<string | null>(null);
  /** A scene edit from the editor or a handle: said in the schema's words and not sent when the API would refuse it. */
  const { saveScene: recordScene } = history;
  const editScene = useCallback(
    (next: Scene): string | null => {
      const problem = sceneProblem(next);
      setEditProblem(problem);
      if (!problem) void recordScene(next);
      return problem;
    },
    [recordScene],
  );
  const tools = usePlanTool({
    baseScene: base,
    mirrorCount: edits.placements.length,
    catalogue,
    saveScene: history.saveScene,
    createPlacement: history.createPlacement,
    select: setSelection,
    onMirrorPlaced: () => setDrawerSize((d) => (d === 'folded' ? 'peek' : d)),
  });

  const onDrag = useCallback(
    (d: PlanDrag) => {
      if (d.kind === 'viewer-move') {
        if (!d.done) return edits.setDragPreview({ kind: 'viewer', id: d.id, positionM: d.positionM });
        edits.setDragPreview(null);
        const positionM: PairM = [roundM(d.positionM[0]), roundM(d.positionM[1])];
        void history.saveScene(moveViewer(edits.baseScene, d.id, positionM));
        return;
      }
      if (d.kind === 'scene-handle') {
        if (!d.done) return edits.setDragPreview({ kind: 'scene', scene: d.scene });
        edits.setDragPreview(null);
        editScene(d.scene);
        return;
      }
      dragPlacement(edits, history.savePlacement, d);
    },
    [edits, history, editScene],
  );

  const deleteSelected = () => {
    const s = selection;
    if (!s) return;
    setSelection(null);
    if (s.kind === 'placement') void history.deletePlacement(s.id);
    else void history.saveScene(removeSceneItem(base, s.kind, s.id));
  };

  const select = (s: PlanSelection) => {
    setSelection(s);
    // On a phone the details open to a peek: the plan above re-centres on the mirror and its fan.
    if (s?.kind === 'placement' && !wide) setDrawerSize((d) => (d === 'folded' ? 'peek' : d));
  };

  // Wide keyboard: Escape closes the editor (saving what was typed), arrows nudge through the history (undoable).
  usePlanKeys(selection, canEdit, (action) => {
    if (action.kind === 'close') {
      if (selection?.kind === 'placement' && edits.writes.unsaved[selection.id]) edits.writes.save(selection.id);
      setSelection(null);
      return;
    }
    const [dx, dy] = action.deltaM;
    if (selection?.kind === 'placement') {
      const p = edits.placements.find((x) => x.id === selection.id);
      if (p) history.savePlacement(p.id, { positionM: nudged(p.positionM, dx, dy) });
    } else if (selection?.kind === 'viewer') {
      const v = base.viewers.find((x) => x.id === selection.id);
      if (v) void history.saveScene(moveViewer(base, v.id, nudged(v.positionM, dx, dy)));
    }
  });

  const tool = canEdit ? tools.tool : 'select';
  /** A drawing tool's sentence and choices fill the bottom of a phone's plan (the toolbar's context panel). */
  const toolPanelShown = !wide && canEdit && tool !== 'select' && drawerSize === 'folded';
  // The review (state, steps, comments, trail) sits above the details; its markers are drawn on the plan.
  const review = useReviewPlan({ project, placements: edits.placements, selection, wide });

  // The customer's plan under the drawing (scene.underlay) and its calibration.
  const files = useProjectFilesQuery(project.id);
  const deleteFile = useDeleteFileMutation(project.id);
  const addFileToCache = useAddFileToCache(project.id);
  const underlay = edits.scene.underlay;
  const planFile = underlay ? files.data?.find((f) => f.id === underlay.fileId) : undefined;
  const underlayImage: UnderlayImage | null =
    underlay && planFile ? { underlay, href: fileAddress(planFile), widthPx: planFile.widthPx, heightPx: planFile.heightPx } : null;
  const calibration = useUnderlayCalibration();
  const baseRef = useRef(base);
  useLayoutEffect(() => {
    baseRef.current = base;
  });
  const calibrating = calibration.active && underlay !== undefined && canEdit;
  /** Scale, turn, shift and look: recorded in the undo history like any drawing change. */
  const changeUnderlay = (next: Underlay) => void editScene(setUnderlay(base, next));
  const startCalibration = () => {
    setSelection(null);
    if (!wide) setDrawerSize('folded');
    calibration.start();
  };
  /**
   * A new plan file or none: saved straight away, not recorded, because the file it replaces is
   * deleted once the scene no longer names it (an undo could not bring the file back).
   */
  const replaceUnderlayFile = async (next: Underlay | undefined) => {
    // Read when the upload ends, not when it started: the drawing may have changed meanwhile.
    const latest = baseRef.current;
    const old = latest.underlay;
    const saved = await edits.saveScene(setUnderlay(latest, next));
    if (saved && old && old.fileId !== next?.fileId) deleteFile.mutate(old.fileId);
    return saved;
  };
  const onPlanUploaded = (file: FileDto) => {
    // The image's size comes from the files list: put the new file there before the scene names it.
    addFileToCache(file);
    void replaceUnderlayFile(underlayForUpload(file, baseRef.current.underlay)).then((saved) => {
      if (saved) startCalibration();
    });
  };
  const setScale = (distanceText: string): string | null => {
    if (!underlay) return 'There is no plan to calibrate.';
    const outcome = calibrationFrom(underlay, calibration.pointsPx, distanceText, units);
    if (!outcome.ok) return outcome.message;
    const problem = editScene(setUnderlay(base, outcome.underlay));
    if (!problem) calibration.cancel();
    return problem;
  };
  const underlayPanel = (
    <UnderlayPanel
      projectId={project.id}
      canEdit={canEdit}
      underlay={base.underlay}
      file={planFile}
      units={units}
      calibrating={calibrating}
      onChange={changeUnderlay}
      onUploaded={onPlanUploaded}
      onCalibrate={startCalibration}
      onRemove={() => void replaceUnderlayFile(undefined)}
    />
  );

  // On a phone with a mirror selected, its editor comes first in the drawer's peek; the review panel follows.
  const editorFirst = !wide && selection?.kind === 'placement';
  const details = (
    <>
      {/* On the wide screen the review panel can fill the side panel's first screenful: the first
          caution stays on top, in view beside the coverage (the phone's drawer carries its own). */}
      {wide ? (
        <AppText variant="small" tone="stop" testID="side-caution">
          {`${CAUTION_SENTENCES[0]} All cautions are listed below.`}
        </AppText>
      ) : null}
      {editorFirst ? null : review.panel}
      <PlanDetails
        project={project}
        scene={edits.scene}
        placements={edits.placements}
        writes={editorWrites}
        evaluation={evaluation}
        catalogue={catalogue}
        units={units}
        canEdit={canEdit}
        selection={selection}
        onSelect={setSelection}
        onViewerEyeHeight={(id: string, eyeHeightM: number) => void history.saveScene(setViewerEyeHeight(base, id, eyeHeightM))}
        onZoneCriterion={(id: string, criterion: CriterionKind) => void history.saveScene(setZoneCriterion(base, id, criterion))}
        onCriteria={(criteria: CriteriaSettings | undefined) => void history.saveScene(setCriteria(base, criteria))}
        underlayPanel={underlayPanel}
      />
      {canEdit ? <SceneItemEditor scene={base} selection={selection} units={units} onEdit={editScene} /> : null}
      {canEdit && selectedPlacementId !== null && edits.placements.some((p) => p.id === selectedPlacementId) ? (
        <AimAtZoneAction
          scene={base}
          placements={edits.writes.placements}
          catalogue={catalogue}
          placementId={selectedPlacementId}
          units={units}
          onAim={(aim) => history.savePlacement(selectedPlacementId, aim)}
          onChoose={(catalogueItemId, aim) => history.savePlacement(selectedPlacementId, { catalogueItemId, customMirror: null, ...aim })}
        />
      ) : null}
      {editorFirst ? review.panel : null}
    </>
  );

  const parts = {
    title: project.name,
    header,
    canvas: (
      <PlanCanvas
        scene={edits.scene}
        placements={edits.placements}
        evaluation={evaluation}
        units={units}
        tool={tool}
        canEdit={canEdit}
        selection={selection}
        onSelect={select}
        onTapPlan={calibrating && underlay ? (pointM) => calibration.tap(underlay, pointM) : review.pinning ? review.onPinTap : tools.tap}
        pinning={calibrating || review.pinning}
        overlay={(view) => (
          <>
            {review.overlay(view)}
            {calibrating && underlay ? <CalibrationMarks underlay={underlay} pointsPx={calibration.pointsPx} view={view} /> : null}
          </>
        )}
        underlay={underlayImage}
        fitKey={underlayImage ? underlay?.fileId : null}
        reserveTop={calibrating ? CALIBRATION_CARD_PX : 0}
        onDrag={onDrag}
        sketchPoints={tools.zoneToName ?? tools.sketch}
        sketchClosed={tools.tool === 'zone'}
        // On a phone "fit" keeps the plan above the floating tools, however tall a tool's panel makes them.
        reserveBottom={wide ? 90 : drawerSize === 'folded' ? Math.max(90, toolbarHeight + 8) : 90}
        // On a phone the zoom row sits low on the right; when a drawing tool's panel fills the bottom it
        // steps up to a stack at the top right (footgun 60), where the notices leave room for it.
        zoomAtBottom={wide || toolPanelShown ? undefined : drawerSize === 'folded' ? Math.max(100, toolbarHeight + 8) : 8}
        focus={!wide && drawerSize !== 'folded' ? focusOf(selection, edits.placements, edits.scene) : null}
      />
    ),
    overPlan: (
      <>
        <EditNotices edits={edits} editorOpenFor={selectedPlacementId} toolProblem={tools.problem} catalogue={catalogue} units={units} />
        {calibrating ? (
          <CalibrationPrompt
            points={calibration.pointsPx.length}
            units={units}
            onSet={setScale}
            onRestart={calibration.restart}
            onCancel={calibration.cancel}
          />
        ) : null}
        {tools.zoneToName ? (
          <ZoneNamePrompt defaultName={`Zone ${base.zones.length + 1}`} onSave={tools.nameZone} onCancel={tools.cancelZoneName} />
        ) : null}
      </>
    ),
    toolbar: (
      <View
        pointerEvents="box-none"
        onLayout={(e) => {
          const h = Math.round(e.nativeEvent.layout.height);
          setToolbarHeight((old) => (old === h ? old : h));
        }}
      >
        {canEdit ? (
          <UndoControls
            canUndo={history.canUndo}
            canRedo={history.canRedo}
            onUndo={history.undo}
            onRedo={history.redo}
            problem={history.problem ?? editProblem}
          />
        ) : null}
        <PlanToolbar
          tool={tool}
          onTool={tools.setTool}
          canEdit={canEdit}
          canDelete={selection !== null}
          onDelete={deleteSelected}
          zonePoints={tools.sketch.length}
          onFinishZone={tools.finishZone}
          onCancelSketch={tools.cancelSketch}
          wallKind={tools.wallKind}
          onWallKind={tools.setWallKind}
          busy={edits.saving}
        />
      </View>
    ),
  };

  const selectedPlacement = selectedPlacementId !== null ? edits.placements.find((p) => p.id === selectedPlacementId) : undefined;
  return (
    <ResponsiveWorkspace
      {...parts}
      wide={wide}
      details={details}
      drawerOpen={drawerSize !== 'folded'}
      drawer={
        <PlanDrawer
          size={drawerSize}
          onSize={setDrawerSize}
          selection={selection}
          placement={selectedPlacement}
          scene={edits.scene}
          evaluation={evaluation}
          units={units}
        >
          {details}
        </PlanDrawer>
      }
    />
  );
}

/** Where the selected item is, for the phone's plan to keep it in the middle above the drawer. */
function focusOf(selection: PlanSelection, placements: readonly PlacementDto[], scene: Scene): { key: string; pointM: PairM } | null {
  if (selection?.kind === 'placement') {
    const p = placements.find((x) => x.id === selection.id);
    return p ? { key: `placement-${p.id}`, pointM: [p.positionM[0], p.positionM[1]] } : null;
  }
  if (selection?.kind === 'viewer') {
    const v = scene.viewers.find((x) => x.id === selection.id);
    return v ? { key: `viewer-${v.id}`, pointM: [v.positionM[0], v.positionM[1]] } : null;
  }
  return null;
}

/** A point moved along one axis: only the moved coordinate is rounded (to the plan's millimetres), the other is kept as it was. */
function nudged(p: readonly [number, number], dx: number, dy: number): PairM {
  return [dx === 0 ? p[0] : roundM(p[0] + dx), dy === 0 ? p[1] : roundM(p[1] + dy)];
}
