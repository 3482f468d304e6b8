/**
 * What sits beside the plan (wide) or in the bottom drawer (phone): the selected item's details, or,
 * with nothing selected, the project summary with the safety cautions.
 */
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText, Badge, Button, Segmented } from '@/components/ui';
import { SafetyCautions } from '@/components/ui/safety-cautions';
import { SheetActions } from '@/components/sheet';
import { palette, radii, spacing } from '@/constants/theme';
import type { PlacementWrites } from '@/hooks/use-placement-writes';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import { adultRangesText, criteriaOf, criterionText, targetLabel, zoneCriterion } from '@/shared/project-optics';
import type { CatalogueItemDto, CriteriaSettings, CriterionKind, PlacementDto, ProjectDto, Scene, SceneViewer } from '@/shared/schemas';
import { CriteriaSettingsForm } from './criteria-settings';
import { formatLength, type UnitSystem } from '@/shared/units';
import { PlacementEditorSlot } from './placement-editor-slot';
import { PhotoGallery } from '@/components/uploads/photo-gallery';
import type { PlanSelection } from './plan-types';
import { bandColours, bandWords, formatCoveredShare, zoneBand } from './zone-quality';

/** Eye heights offered for a viewer. 2.1 m for a seated forklift driver and 1.6 m for a standing pedestrian are round working figures, not from a standard; the installer measures on site. */
export const EYE_HEIGHTS = { driver: 2.1, pedestrian: 1.6 } as const;

export interface PlanDetailsProps {
  project: ProjectDto;
  scene: Scene;
  placements: readonly PlacementDto[];
  /** The one write path for placements, shared with the editor. */
  writes: PlacementWrites;
  evaluation: PlanEvaluation | null;
  catalogue: readonly CatalogueItemDto[];
  units: UnitSystem;
  canEdit: boolean;
  selection: PlanSelection;
  onSelect: (s: PlanSelection) => void;
  onViewerEyeHeight: (viewerId: string, eyeHeightM: number) => void;
  /** Sets whether a zone asks for its target to be detected or recognised. */
  onZoneCriterion: (zoneId: string, criterion: CriterionKind) => void;
  /** Sets the project's two angles; undefined goes back to the defaults. */
  onCriteria: (criteria: CriteriaSettings | undefined) => void;
  /** The customer's plan under the drawing: upload, calibrate, place (the workspace wires it). */
  underlayPanel?: ReactNode;
}

export function PlanDetails(p: PlanDetailsProps) {
  const sel = p.selection;
  if (sel?.kind === 'placement' && p.placements.some((x) => x.id === sel.id)) {
    return (
      <View style={styles.column}>
        <BackToSummary onPress={() => p.onSelect(null)} />
        <PlacementEditorSlot
          project={p.project}
          scene={p.scene}
          placement={p.placements.find((x) => x.id === sel.id) ?? null}
          writes={p.writes}
          catalogue={p.catalogue}
          units={p.units}
          canEdit={p.canEdit}
          evaluation={p.evaluation}
          onClose={() => p.onSelect(null)}
        />
      </View>
    );
  }
  if (sel?.kind === 'viewer') {
    const viewer = p.scene.viewers.find((v) => v.id === sel.id);
    if (viewer) return <ViewerDetails {...p} viewer={viewer} />;
  }
  if (sel?.kind === 'zone') {
    const zone = p.scene.zones.find((z) => z.id === sel.id);
    const ev = p.evaluation?.zones.find((z) => z.zoneId === sel.id);
    if (zone) {
      const band = zoneBand(ev?.fraction ?? Number.NaN);
      return (
        <View style={styles.column} testID="plan-zone-details">
          <BackToSummary onPress={() => p.onSelect(null)} />
          <AppText variant="heading">{zone.name}</AppText>
          <Segmented<CriterionKind>
            label="What the mirrors must let the viewer do here"
            value={zoneCriterion(zone)}
            disabled={!p.canEdit}
            stretch
            onChange={(c) => p.onZoneCriterion(zone.id, c)}
            options={[
              { value: 'detect', label: 'Detect (notice)', testID: 'zone-criterion-detect' },
              { value: 'recognise', label: 'Recognise (make out)', testID: 'zone-criterion-recognise' },
            ]}
          />
          <AppText testID="zone-criterion-text">
            {`Must show a ${targetLabel(zone.target)} so that they are ${zoneCriterion(zone) === 'detect' ? 'detected' : 'recognised'}: ${criterionText(criteriaOf(p.scene), zoneCriterion(zone))} at the viewer's eye.`}
          </AppText>
          <AppText variant="bodyStrong" style={{ color: bandColours[band].text }}>
            {ev?.problem ?? `${formatCoveredShare(ev?.fraction ?? Number.NaN)} covered — ${bandWords[band]}`}
          </AppText>
          <AppText variant="small" tone="muted">
            The hatched part of the zone on the plan is what no mirror shows.
          </AppText>
        </View>
      );
    }
  }
  if (sel?.kind === 'wall') {
    const wall = p.scene.walls.find((w) => w.id === sel.id);
    if (wall) {
      const lengthM = Math.hypot(wall.bM[0] - wall.aM[0], wall.bM[1] - wall.aM[1]);
      return (
        <View style={styles.column} testID="plan-wall-details">
          <BackToSummary onPress={() => p.onSelect(null)} />
          <AppText variant="heading">{wall.kind === 'racking' ? 'Racking' : wall.kind === 'door' ? 'Doorway' : 'Wall'}</AppText>
          <AppText>{`${formatLength(lengthM, p.units)} long, ${formatLength(wall.heightM, p.units)} high.`}</AppText>
        </View>
      );
    }
  }
  return <ProjectSummary {...p} />;
}

function BackToSummary({ onPress }: { onPress: () => void }) {
  return <Button label="‹ Project summary" variant="quiet" testID="plan-details-back" onPress={onPress} style={styles.back} />;
}

function ViewerDetails(p: PlanDetailsProps & { viewer: SceneViewer }) {
  const { viewer } = p;
  const kind =
    Math.abs(viewer.eyeHeightM - EYE_HEIGHTS.driver) < 1e-6
      ? 'driver'
      : Math.abs(viewer.eyeHeightM - EYE_HEIGHTS.pedestrian) < 1e-6
        ? 'pedestrian'
        : undefined;
  const served = p.placements.filter((x) => x.viewerId === viewer.id);
  return (
    <View style={styles.column} testID="plan-viewer-details">
      <BackToSummary onPress={() => p.onSelect(null)} />
      <AppText variant="heading">{viewer.name}</AppText>
      <AppText>{`Eye ${formatLength(viewer.eyeHeightM, p.units)} above the floor.`}</AppText>
      <Segmented<'driver' | 'pedestrian'>
        label="Who looks from here"
        value={kind}
        disabled={!p.canEdit}
        stretch
        onChange={(k) => p.onViewerEyeHeight(viewer.id, EYE_HEIGHTS[k])}
        options={[
          { value: 'driver', label: 'Driver (seated, forklift)', testID: 'viewer-kind-driver' },
          { value: 'pedestrian', label: 'Pedestrian', testID: 'viewer-kind-pedestrian' },
        ]}
      />
      <AppText variant="small" tone="muted">
        {served.length === 0 ? 'No mirror serves this viewer yet.' : `Served by ${served.map((x) => x.label).join(', ')}.`}
      </AppText>
    </View>
  );
}

function ProjectSummary(p: PlanDetailsProps) {
  const evalById = new Map((p.evaluation?.placements ?? []).map((e) => [e.placementId, e]));
  return (
    <View style={styles.column} testID="plan-summary">
      {/* The customer's plan first: on a new job it is what the installer starts from. */}
      {p.underlayPanel && (p.canEdit || p.scene.underlay) ? <Section title="Customer’s plan">{p.underlayPanel}</Section> : null}
      <Section title="Zones">
        {p.scene.zones.length === 0 ? (
          <AppText tone="muted">No zones yet. Draw the area a mirror must show with the Zone tool.</AppText>
        ) : null}
        {p.scene.zones.map((z) => {
          const ev = p.evaluation?.zones.find((e) => e.zoneId === z.id);
          const band = zoneBand(ev?.fraction ?? Number.NaN);
          return (
            <ListRow key={z.id} testID={`summary-zone-${z.id}`} onPress={() => p.onSelect({ kind: 'zone', id: z.id })}>
              <View style={styles.rowMain}>
                <AppText variant="bodyStrong">{z.name}</AppText>
                <AppText variant="small" tone="muted">{`Target: ${targetLabel(z.target)}, ${zoneCriterion(z)}`}</AppText>
              </View>
              <View style={styles.rowEnd}>
                <AppText variant="bodyStrong" style={{ color: bandColours[band].text }}>
                  {formatCoveredShare(ev?.fraction ?? Number.NaN)}
                </AppText>
                <Badge
                  label={bandWords[band]}
                  tone={band === 'good' ? 'go' : band === 'partial' ? 'beacon' : band === 'poor' ? 'stop' : 'neutral'}
                />
              </View>
            </ListRow>
          );
        })}
      </Section>
      <Section title="Mirrors">
        {p.placements.length === 0 ? (
          <AppText tone="muted">No mirrors yet. Choose Mirror and tap the plan where one mounts.</AppText>
        ) : null}
        {p.placements.map((pl) => {
          const ev = evalById.get(pl.id);
          return (
            <ListRow key={pl.id} testID={`summary-placement-${pl.id}`} onPress={() => p.onSelect({ kind: 'placement', id: pl.id })}>
              <View style={styles.rowMain}>
                <AppText variant="bodyStrong">{pl.label}</AppText>
                {ev?.problem ? (
                  <AppText variant="small" tone="stop" testID={`summary-placement-problem-${pl.id}`}>
                    {ev.problem.message}
                  </AppText>
                ) : ev?.numbers ? (
                  <AppText variant="small" tone="muted">
                    {adultRangesText(ev.numbers, (m) => formatLength(m, p.units))}
                  </AppText>
                ) : null}
              </View>
            </ListRow>
          );
        })}
      </Section>
      <Section title="Viewers">
        {p.scene.viewers.length === 0 ? (
          <AppText tone="muted">No viewers yet. Choose Viewer and tap where the driver or pedestrian looks from.</AppText>
        ) : null}
        {p.scene.viewers.map((v) => (
          <ListRow key={v.id} testID={`summary-viewer-${v.id}`} onPress={() => p.onSelect({ kind: 'viewer', id: v.id })}>
            <View style={styles.rowMain}>
              <AppText variant="bodyStrong">{v.name}</AppText>
              <AppText variant="small" tone="muted">{`Eye ${formatLength(v.eyeHeightM, p.units)}`}</AppText>
            </View>
          </ListRow>
        ))}
      </Section>
      <Section title="Photos of the job">
        <PhotoGallery projectId={p.project.id} placementId={null} canEdit={p.canEdit} testID="job-photos" />
      </Section>
      <Section title="Detect and recognise">
        <CriteriaSettingsForm criteria={criteriaOf(p.scene)} canEdit={p.canEdit} onSave={p.onCriteria} />
      </Section>
      <SafetyCautions compact />
      <SheetActions projectId={p.project.id} canEdit={p.project.canEdit} />
    </View>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={styles.section}>
      <AppText variant="caps" tone="muted" role="heading" aria-level={2}>
        {title}
      </AppText>
      {children}
    </View>
  );
}

/** A row that selects an item; its accessible name is its visible text (name, figure, verdict). */
function ListRow({ children, onPress, testID }: { children: ReactNode; onPress: () => void; testID: string }) {
  return (
    <Pressable
      testID={testID}
      role="button"
      onPress={onPress}
      style={({ hovered, pressed }) => [styles.listRow, (hovered || pressed) && styles.listRowHover]}
    >
      {children}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.md },
  back: { alignSelf: 'flex-start', paddingHorizontal: 0 },
  section: { gap: spacing.xs },
  listRow: {
    minHeight: 48,
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    paddingVertical: spacing.sm,
    paddingHorizontal: spacing.md,
    borderRadius: radii.sm,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
    backgroundColor: palette.card,
  },
  listRowHover: { backgroundColor: palette.chalk },
  rowMain: { flex: 1, gap: 2 },
  rowEnd: { alignItems: 'flex-end', gap: 4 },
});
