/**
 * The project screen: the live plan and its details. Phone: the plan fills the screen, tools at the
 * bottom, details in a sheet that slides up. Wide: plan left, details panel right.
 */
import type { UseQueryResult } from '@tanstack/react-query';
import { useCallback, useLayoutEffect, useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { PageTitle } from '@/components/ui/page-title';
import { AppText, Badge, Button, CenteredMessage, Notice, TextLink } from '@/components/ui';
import { useDisplayUnits } from '@/components/placement/use-display-units';
import { layout, palette, spacing } from '@/constants/theme';
import { useIsWide } from '@/hooks/use-breakpoint';
import { usePlanEdits } from '@/hooks/use-plan-edits';
import { usePlanEvaluation } from '@/hooks/use-plan-evaluation';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';
import { isSimpleRing } from '@/shared/optics';
import type { CatalogueItemDto, CriteriaSettings, CriterionKind, ProjectDto, SceneWall } from '@/shared/schemas';
import { limitProblem } from '@/shared/schemas/limits';
import { markRedrawEnd } from './perf-marks';
import { PlanCanvas, type PlanDrag } from './plan-canvas';
import { PlacementConflictNotice } from '@/components/placement/placement-conflict';
import { PlanDetails } from './plan-details';
import { PlanDrawer } from './plan-drawer';
import { PlanToolbar } from './plan-toolbar';
import type { PlanSelection, PlanTool } from './plan-types';
import type { PairM } from './plan-view';
import { newSceneId, newMirrorBody, roundM, WALL_HEIGHT_M } from './plan-edits';
import { ZoneNamePrompt, type NewZoneTarget } from './zone-name-prompt';

export interface ProjectWorkspaceProps {
  projectId: number;
  project: UseQueryResult<ProjectDto>;
  catalogue: UseQueryResult<CatalogueItemDto[]>;
}

export function ProjectWorkspace({ projectId, project, catalogue }: ProjectWorkspaceProps) {
  if (!Number.isInteger(projectId) || projectId <= 0) {
    return (
      <CenteredMessage
        title="No such project"
        body="The address does not name a project."
        titleTestID="project-title"
        action={<TextLink href="/projects" label="Back to projects" testID="project-back" />}
      />
    );
  }
  const failed = project.error ?? catalogue.error;
  if (failed) {
    const notFound = failed instanceof ApiError && (failed.status === 404 || failed.status === 403);
    return (
      <CenteredMessage
        title={notFound ? 'This project is not available' : 'The project could not be loaded'}
        body={describeError(failed)}
        testID="project-error"
        action={
          notFound ? (
            <TextLink href="/projects" label="Back to projects" testID="project-back" />
          ) : (
            <Button label="Try again" testID="project-retry" onPress={() => void Promise.all([project.refetch(), catalogue.refetch()])} />
          )
        }
      />
    );
  }
  if (!project.data || !catalogue.data) return <CenteredMessage loading title="Opening the plan…" testID="project-loading" />;
  return <Workspace key={project.data.id} project={project.data} catalogue={catalogue.data} />;
}

function Workspace({ project, catalogue }: { project: ProjectDto; catalogue: CatalogueItemDto[] }) {
  const wide = useIsWide();
  const units = useDisplayUnits(project);
  const edits = usePlanEdits(project);
  const [selection, setSelection] = useState<PlanSelection>(null);
  const evaluation = usePlanEvaluation(edits.scene, edits.placements, catalogue, selection?.kind === 'placement' ? selection.id : null);
  const canEdit = project.canEdit;
  const [tool, setToolState] = useState<PlanTool>('select');
  const [draft, setDraft] = useState<PairM[]>([]);
  const [wallKind, setWallKind] = useState<SceneWall['kind']>('wall');
  const [zonePrompt, setZonePrompt] = useState<PairM[] | null>(null);
  const [localProblem, setLocalProblem] = useState<string | null>(null);
  const [sheetOpen, setSheetOpen] = useState(false);

  // Closes the performance measure of a live drag frame once React has committed it.
  useLayoutEffect(() => {
    if (edits.live) markRedrawEnd();
  }, [edits.live]);

  const setTool = (t: PlanTool) => {
    setToolState(t);
    setDraft([]);
    setLocalProblem(null);
  };

  const base = edits.baseScene;

  const onTapPlan = (raw: PairM) => {
    const pointM: PairM = [roundM(raw[0]), roundM(raw[1])];
    setLocalProblem(null);
    // The project's limits, said before sending what the server would refuse.
    const full =
      tool === 'mirror'
        ? limitProblem('mirror', base, edits.placements.length)
        : tool === 'viewer'
          ? limitProblem('viewer', base, 0)
          : tool === 'wall' && draft.length === 0
            ? limitProblem('wall', base, 0)
            : tool === 'zone'
              ? ((draft.length === 0 ? limitProblem('zone', base, 0) : null) ?? limitProblem('zoneCorner', base, 0, draft.length))
              : null;
    if (full) return setLocalProblem(full);
    if (tool === 'mirror') {
      const body = newMirrorBody(pointM, catalogue, base.viewers, edits.placements.length);
      if (!body) return setLocalProblem('The catalogue has no mirrors yet; ask your administrator to add one.');
      void edits.createPlacement(body).then((created) => {
        if (!created) return;
        setSelection({ kind: 'placement', id: created.id });
        setToolState('select');
        setSheetOpen(true);
      });
    } else if (tool === 'viewer') {
      const id = newSceneId('v');
      const viewer = { id, name: `Viewer ${base.viewers.length + 1}`, positionM: pointM, eyeHeightM: 2.1 };
      void edits.saveScene({ ...base, viewers: [...base.viewers, viewer] });
      setSelection({ kind: 'viewer', id });
      setToolState('select');
    } else if (tool === 'zone') {
      setDraft((d) => [...d, pointM]);
    } else if (tool === 'wall') {
      if (draft.length === 0) return setDraft([pointM]);
      const a = draft[0];
      setDraft([]);
      if (Math.hypot(pointM[0] - a[0], pointM[1] - a[1]) < 0.05)
        return setLocalProblem('The two ends are too close; tap the second end farther away.');
      const wall: SceneWall = { id: newSceneId('w'), kind: wallKind, aM: a, bM: pointM, heightM: WALL_HEIGHT_M[wallKind] };
      void edits.saveScene({ ...base, walls: [...base.walls, wall] });
    }
  };

  const finishZone = () => {
    if (draft.length < 3) return;
    if (!isSimpleRing(draft))
      return setLocalProblem('The outline crosses itself; tap Cancel and draw the corners in order around the zone.');
    setZonePrompt(draft);
  };

  const saveZone = (name: string, target: NewZoneTarget) => {
    if (!zonePrompt) return;
    const id = newSceneId('z');
    void edits.saveScene({ ...base, zones: [...base.zones, { id, name, polygonM: zonePrompt, target: { kind: target } }] });
    setZonePrompt(null);
    setDraft([]);
    setSelection({ kind: 'zone', id });
    setToolState('select');
  };

  const onDrag = useCallback(
    (d: PlanDrag) => {
      if (d.kind === 'viewer-move') {
        if (!d.done) return edits.setLive({ kind: 'viewer', id: d.id, positionM: d.positionM });
        edits.setLive(null);
        const positionM: PairM = [roundM(d.positionM[0]), roundM(d.positionM[1])];
        void edits.saveScene({
          ...edits.baseScene,
          viewers: edits.baseScene.viewers.map((v) => (v.id === d.id ? { ...v, positionM } : v)),
        });
        return;
      }
      const patch =
        d.kind === 'placement-move'
          ? { positionM: [roundM(d.positionM[0]), roundM(d.positionM[1])] as PairM }
          : { azimuthRad: Math.round(d.azimuthRad * 1e4) / 1e4 };
      if (!d.done) return edits.setLive({ kind: 'placement', id: d.id, patch });
      edits.setLive(null);
      void edits.savePlacement(d.id, patch);
    },
    [edits],
  );

  const deleteSelected = () => {
    const s = selection;
    if (!s) return;
    setSelection(null);
    if (s.kind === 'placement') void edits.deletePlacement(s.id);
    else if (s.kind === 'viewer') void edits.saveScene({ ...base, viewers: base.viewers.filter((v) => v.id !== s.id) });
    else if (s.kind === 'zone') void edits.saveScene({ ...base, zones: base.zones.filter((z) => z.id !== s.id) });
    else void edits.saveScene({ ...base, walls: base.walls.filter((w) => w.id !== s.id) });
  };

  const onViewerEyeHeight = (viewerId: string, eyeHeightM: number) =>
    void edits.saveScene({ ...base, viewers: base.viewers.map((v) => (v.id === viewerId ? { ...v, eyeHeightM } : v)) });

  const onZoneCriterion = (zoneId: string, criterion: CriterionKind) =>
    void edits.saveScene({ ...base, zones: base.zones.map((z) => (z.id === zoneId ? { ...z, criterion } : z)) });

  // Leaving `criteria` out of the scene means the defaults (shared/project-optics/criteria.ts).
  const onCriteria = (criteria: CriteriaSettings | undefined) => {
    const rest = { walls: base.walls, zones: base.zones, viewers: base.viewers };
    void edits.saveScene(criteria ? { ...rest, criteria } : rest);
  };

  const select = (s: PlanSelection) => {
    setSelection(s);
    if (s?.kind === 'placement' && !wide) setSheetOpen(true);
  };

  const problem = edits.problem;
  const banner = (
    <>
      {problem ? (
        <Notice tone="stop" testID="plan-save-error">
          <AppText variant="bodyStrong" tone="stop">
            {problem.message}
          </AppText>
          <View style={styles.bannerRow}>
            {problem.retry ? <Button label="Try again" testID="plan-save-retry" onPress={problem.retry} /> : null}
            <Button label="Dismiss" variant="quiet" testID="plan-save-dismiss" onPress={edits.dismissProblem} />
          </View>
        </Notice>
      ) : null}
      {/* A mirror's conflict shows in its editor when open; otherwise here, so a drag's conflict is never silent. */}
      {Object.entries(edits.writes.conflicts)
        .filter(([id]) => !(selection?.kind === 'placement' && selection.id === Number(id)))
        .map(([id, conflict]) => (
          <PlacementConflictNotice
            key={id}
            conflict={conflict}
            units={units}
            catalogue={catalogue}
            label={edits.placements.find((p) => p.id === Number(id))?.label}
            onKeepMine={() => edits.writes.keepMine(Number(id))}
            onUseTheirs={() => edits.writes.useTheirs(Number(id))}
          />
        ))}
      {localProblem ? (
        <Notice tone="stop" testID="plan-tool-error">
          {localProblem}
        </Notice>
      ) : null}
    </>
  );

  const details = (
    <PlanDetails
      project={project}
      scene={edits.scene}
      placements={edits.placements}
      writes={edits.writes}
      evaluation={evaluation}
      catalogue={catalogue}
      units={units}
      canEdit={canEdit}
      selection={selection}
      onSelect={setSelection}
      onViewerEyeHeight={onViewerEyeHeight}
      onZoneCriterion={onZoneCriterion}
      onCriteria={onCriteria}
    />
  );

  const toolbar = (
    <PlanToolbar
      tool={canEdit ? tool : 'select'}
      onTool={setTool}
      canEdit={canEdit}
      canDelete={selection !== null}
      onDelete={deleteSelected}
      zonePoints={draft.length}
      onFinishZone={finishZone}
      onCancelDraft={() => setDraft([])}
      wallKind={wallKind}
      onWallKind={setWallKind}
      busy={edits.saving}
    />
  );

  const plan = (
    <View style={styles.planArea}>
      <PlanCanvas
        scene={edits.scene}
        placements={edits.placements}
        evaluation={evaluation}
        units={units}
        tool={canEdit ? tool : 'select'}
        canEdit={canEdit}
        selection={selection}
        onSelect={select}
        onTapPlan={onTapPlan}
        onDrag={onDrag}
        draftPoints={zonePrompt ?? draft}
        draftClosed={tool === 'zone'}
        reserveBottom={wide ? 90 : 90}
      />
      <View style={[styles.overlayTop, wide && styles.overlayTopWide]} pointerEvents="box-none">
        {banner}
        {zonePrompt ? (
          <ZoneNamePrompt defaultName={`Zone ${base.zones.length + 1}`} onSave={saveZone} onCancel={() => setZonePrompt(null)} />
        ) : null}
      </View>
      {/* With the sheet open the plan strip is short; the tools come back when it closes. */}
      {wide || !sheetOpen ? (
        <View style={[styles.overlayBottom, wide && styles.overlayBottomWide]} pointerEvents="box-none">
          {toolbar}
        </View>
      ) : null}
    </View>
  );

  const header = (
    <View style={[styles.header, wide && styles.headerWide]}>
      <TextLink href="/projects" label="‹ Projects" testID="project-back" />
      <View style={styles.headerMain}>
        <AppText variant={wide ? 'heading' : 'label'} numberOfLines={1} role="heading" aria-level={1} testID="project-title">
          {project.name}
        </AppText>
        {wide && (project.customer || project.site) ? (
          <AppText variant="small" tone="muted" numberOfLines={1}>
            {[project.customer, project.site].filter(Boolean).join(' · ')}
          </AppText>
        ) : null}
      </View>
      {!canEdit ? <Badge label="Read only" tone="glass" testID="project-read-only" /> : null}
      <AppText variant="small" tone={problem ? 'stop' : 'muted'} testID="plan-save-status" aria-live="polite">
        {edits.saving ? 'Saving…' : problem && edits.unsaved ? 'Not saved' : ''}
      </AppText>
    </View>
  );

  if (wide) {
    return (
      <View style={styles.wideRoot}>
        <PageTitle title={project.name} />
        <View style={styles.wideMain}>
          {header}
          {plan}
        </View>
        <ScrollView style={styles.panel} contentContainerStyle={styles.panelContent} testID="plan-panel">
          {details}
        </ScrollView>
      </View>
    );
  }

  const selectedPlacement = selection?.kind === 'placement' ? edits.placements.find((p) => p.id === selection.id) : undefined;
  return (
    <View style={styles.phoneRoot}>
      <PageTitle title={project.name} />
      {header}
      {plan}
      <PlanDrawer
        open={sheetOpen}
        onToggle={() => setSheetOpen((o) => !o)}
        selection={selection}
        placement={selectedPlacement}
        scene={edits.scene}
        evaluation={evaluation}
        units={units}
      >
        {details}
      </PlanDrawer>
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: palette.chalk },
  wideMain: { flex: 1 },
  phoneRoot: { flex: 1, backgroundColor: palette.chalk },
  header: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    paddingHorizontal: spacing.sm,
    minHeight: layout.minTarget,
    backgroundColor: palette.chalk,
    borderBottomWidth: 1,
    borderBottomColor: palette.ruleSoft,
  },
  headerWide: { paddingHorizontal: spacing.lg, paddingVertical: spacing.sm },
  headerMain: { flex: 1, minWidth: 0 },
  planArea: { flex: 1, position: 'relative' },
  overlayTop: { position: 'absolute', top: spacing.sm, left: spacing.sm, right: spacing.sm + 56, gap: spacing.sm },
  overlayTopWide: { left: spacing.lg, right: 'auto', width: 440 },
  overlayBottom: { position: 'absolute', bottom: spacing.sm, left: spacing.sm, right: spacing.sm },
  overlayBottomWide: { left: spacing.lg, right: 'auto', width: 560 },
  bannerRow: { flexDirection: 'row', gap: spacing.sm, marginTop: spacing.xs },
  panel: { width: 420, flexGrow: 0, borderLeftWidth: 1, borderLeftColor: palette.rule, backgroundColor: palette.chalk },
  panelContent: { padding: spacing.lg, gap: spacing.lg },
});
