import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui/text';
import { Notice } from '@/components/ui/notice';
import { palette, radii, spacing } from '@/constants/theme';
import { criteriaSentence, targetLabel, zoneCriterion, type EvaluatedPlacement, type EvaluatedZone } from '@/shared/project-optics';
import type { Scene } from '@/shared/schemas';
import { formatAngle, formatArea, formatLength, formatNumber, formatPercent, formatRange, type UnitSystem } from '@/shared/units';
import { formatCoveredShare } from '@/shared/zone-verdict';

export interface PlacementNumbersPanelProps {
  evaluation: EvaluatedPlacement | null;
  /** Zone fractions from evaluateProject run with this placement's current values, unsaved edits included. */
  zones: readonly EvaluatedZone[];
  scene: Scene;
  units: UnitSystem;
}

const dist = (m: number, units: UnitSystem) => formatLength(m, units, { kind: 'distance' });
const size = (m: number, units: UnitSystem) => formatLength(m, units, { kind: 'size' });

/** Plain words for the rim squeeze figure (rim magnification ÷ centre magnification). */
export function rimSqueezeText(rimSqueeze: number): string {
  if (!(rimSqueeze > 0))
    return 'From this eye position the rim is out of sight, so the edge of the image cannot be compared with the centre.';
  return `At the rim, things look ${formatPercent(rimSqueeze)} of the size they would at the centre of the mirror.`;
}

/**
 * The engine's numbers for one placement, formatted in the person's units. Every value comes from
 * `evaluation` and `zones`; nothing here computes optics.
 */
export function PlacementNumbersPanel({ evaluation, zones, scene, units }: PlacementNumbersPanelProps) {
  const n = evaluation?.numbers ?? null;
  const fs = n?.floorSeen ?? null;
  return (
    <View style={styles.panel} testID="numbers-panel">
      {evaluation?.problem ? (
        <Notice tone="stop" testID="numbers-problem">
          {evaluation.problem.message}
        </Notice>
      ) : null}
      {n ? (
        <>
          <Group title="What this viewer sees">
            <Row label="Eye to mirror" value={dist(n.eyeDistanceM, units)} testID="numbers-eye-distance" />
            <Row label="Eye off the mirror's axis" value={formatAngle(n.eyeOffAxisRad)} testID="numbers-eye-off-axis" />
            <Row
              label="Floor area seen"
              value={evaluation?.coverage ? formatArea(evaluation.coverage.areaM2, units) : '—'}
              testID="numbers-area"
            />
            <Row
              label="Spread of the floor seen, around the mirror"
              value={fs ? formatAngle(fs.spreadRad) : '—'}
              testID="numbers-floor-spread"
            />
            <Row
              label="Nearest to farthest floor seen, from the mirror"
              value={fs ? `${dist(fs.nearestM, units)} to ${dist(fs.farthestM, units)}` : '—'}
              testID="numbers-floor-reach"
            />
            <AppText variant="small" tone="muted">
              Floor seen with walls and racking, out to the distance at which a standing adult is still recognised.
            </AppText>
          </Group>

          <Group title="The mirror">
            <Row label="Focal length" value={size(n.focalLengthM, units)} testID="numbers-focal-length" />
            <Row label="Radius of curvature" value={size(n.radiusM, units)} testID="numbers-radius" />
            <Row
              label="Field of view on axis (eye on the mirror's axis), across × up-down"
              value={`${formatAngle(n.onAxisFieldOfView.horizontalRad)} × ${formatAngle(n.onAxisFieldOfView.verticalRad)}`}
              testID="numbers-field-of-view"
            />
          </Group>

          <Group title="Detect and recognise">
            <Row
              label="Standing adult detected up to"
              value={formatRange(n.rangesM.detect.adult, units)}
              testID="numbers-range-adult-detect"
            />
            <Row
              label="Standing adult recognised up to"
              value={formatRange(n.rangesM.recognise.adult, units)}
              testID="numbers-range-adult-recognise"
            />
            <Row label="Child detected up to" value={formatRange(n.rangesM.detect.child, units)} testID="numbers-range-child-detect" />
            <Row
              label="Child recognised up to"
              value={formatRange(n.rangesM.recognise.child, units)}
              testID="numbers-range-child-recognise"
            />
            <AppText variant="small" tone="muted" testID="numbers-criteria-basis">
              {criteriaSentence(n.criteria)}
            </AppText>
          </Group>

          <Group title="How far away things look">
            {n.references.map((r) => (
              <View key={r.objectDistanceM} style={styles.reference} testID={`numbers-reference-${r.objectDistanceM}`}>
                <AppText variant="bodyStrong">A person {dist(r.objectDistanceM, units)} from the mirror</AppText>
                <AppText variant="small" testID={`numbers-reference-${r.objectDistanceM}-text`}>
                  {`shows at ×${formatNumber(r.magnification, 3)} size; true distance ${dist(r.trueDistanceM, units)}, looks like ${dist(r.sizeCueDistanceM, units)} (${formatNumber(r.ratio, 1)} times as far).`}
                </AppText>
              </View>
            ))}
          </Group>

          <Group title="Edge of the image">
            <AppText testID="numbers-rim-squeeze">{rimSqueezeText(n.rimSqueeze)}</AppText>
          </Group>
        </>
      ) : null}

      {scene.zones.length > 0 ? (
        <Group title="Zones covered (all mirrors)">
          {scene.zones.map((z) => {
            const ev = zones.find((e) => e.zoneId === z.id);
            const value = !ev
              ? '—'
              : ev.problem
                ? ev.problem
                : Number.isFinite(ev.fraction)
                  ? `${formatCoveredShare(ev.fraction)} (${formatArea(ev.coveredM2, units)})`
                  : '—';
            return (
              <Row
                key={z.id}
                label={`${z.name}, ${targetLabel(z.target)}, ${zoneCriterion(z)}`}
                value={value}
                testID={`numbers-zone-${z.id}`}
              />
            );
          })}
        </Group>
      ) : null}
    </View>
  );
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <View style={styles.group}>
      <AppText variant="caps" tone="muted">
        {title}
      </AppText>
      {children}
    </View>
  );
}

function Row({ label, value, testID }: { label: string; value: string; testID: string }) {
  return (
    <View style={styles.row}>
      <AppText style={styles.rowLabel}>{label}</AppText>
      <AppText variant="mono" style={styles.rowValue} testID={testID}>
        {value}
      </AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: spacing.lg },
  group: { gap: spacing.sm, paddingTop: spacing.sm, borderTopWidth: 1, borderTopColor: palette.ruleSoft },
  row: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: spacing.sm, alignItems: 'baseline' },
  rowLabel: { flexShrink: 1 },
  rowValue: { textAlign: 'right', flexShrink: 1 },
  reference: { gap: spacing.xxs, padding: spacing.sm, borderRadius: radii.sm, backgroundColor: palette.chalk },
});
