/**
 * "Aim at this zone" for the selected mirror: choose a zone, press once, and the mirror is turned
 * (azimuth and tilt) to the aim the engine's sizing search finds best for that zone
 * (shared/project-optics/aim-at-zone.ts). The share before and after is shown; the turn is one
 * plan edit, so Undo turns it back. The search is bounded (AIM_CANDIDATES_MAX aims) and starts after
 * the busy state has been drawn, so the screen says it is working. "Compare mirrors here" ranks the
 * catalogue's mirrors for the same mount and zone (`sizeForZone`), each at its best aim; choosing
 * one is one plan edit too.
 */
import { useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText, Button, Segmented } from '@/components/ui';
import { palette, radii, spacing } from '@/constants/theme';
import { aimAtZone, sizeForZoneSteps, zoneCriterion, type AimAtZoneResult, type SizeForZoneResult } from '@/shared/project-optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '@/shared/schemas';
import type { Aim } from '@/shared/optics';
import { formatMoney, formatRange, type UnitSystem } from '@/shared/units';
import { formatCoveredShare } from './zone-quality';

export interface AimAtZoneActionProps {
  scene: Scene;
  placements: readonly PlacementDto[];
  catalogue: readonly CatalogueItemDto[];
  placementId: number;
  units: UnitSystem;
  onAim: (aim: Aim) => void;
  /** Puts another catalogue mirror here at the given aim (one plan edit, so Undo puts the old one back). */
  onChoose: (catalogueItemId: number, aim: Aim) => void;
}

/** What the person reads after a search: the zone's share before and after, or why nothing changed. */
export function aimOutcomeText(zoneName: string, r: AimAtZoneResult): string {
  if ('problem' in r) return r.problem;
  const before = formatCoveredShare(r.shareBefore);
  const after = formatCoveredShare(r.shareAfter);
  if (r.shareAfter <= r.shareBefore) return `No aim shows more of ${zoneName} than now (${before}); the mirror stays as it is.`;
  return `${zoneName}: ${before} → ${after} seen. Undo turns the mirror back.`;
}

export function AimAtZoneAction(p: AimAtZoneActionProps) {
  const zones = p.scene.zones;
  const [zoneId, setZoneId] = useState<string | undefined>(undefined);
  const [busy, setBusy] = useState(false);
  const [outcome, setOutcome] = useState<string | null>(null);
  const [comparing, setComparing] = useState<{ done: number; of: number } | null>(null);
  const cancelled = useRef(false);
  useEffect(
    () => () => {
      cancelled.current = true;
    },
    [],
  );
  const [sizing, setSizing] = useState<{ zoneId: string; result: SizeForZoneResult } | null>(null);
  const zone = zones.find((z) => z.id === zoneId) ?? zones[0];
  if (!zone) return null;
  const current = p.placements.find((x) => x.id === p.placementId);

  const compare = () => {
    setComparing({ done: 0, of: 0 });
    setSizing(null);
    const forZone = zone.id;
    const steps = sizeForZoneSteps({
      scene: p.scene,
      placements: p.placements,
      catalogue: p.catalogue,
      placementId: p.placementId,
      zoneId: forZone,
    });
    // One catalogue mirror per turn of the page's loop, so taps and redraws get through meanwhile.
    const next = () => {
      if (cancelled.current) return;
      try {
        const step = steps.next();
        if (step.done) {
          setSizing({ zoneId: forZone, result: step.value });
          setComparing(null);
        } else {
          setComparing(step.value);
          setTimeout(next, 0);
        }
      } catch (e) {
        setComparing(null);
        setSizing({
          zoneId: forZone,
          result: { problem: `The mirrors could not be compared here: ${e instanceof Error ? e.message : String(e)}` },
        });
      }
    };
    setTimeout(next, 30);
  };
  const shown = sizing && sizing.zoneId === zone.id ? sizing.result : null;

  const run = () => {
    setBusy(true);
    setOutcome(null);
    // Let the busy state reach the screen before the search takes the thread.
    setTimeout(() => {
      try {
        const r = aimAtZone({
          scene: p.scene,
          placements: p.placements,
          catalogue: p.catalogue,
          placementId: p.placementId,
          zoneId: zone.id,
        });
        setOutcome(aimOutcomeText(zone.name, r));
        if (!('problem' in r) && r.shareAfter > r.shareBefore) p.onAim(r.aim);
      } finally {
        setBusy(false);
      }
    }, 30);
  };

  return (
    <View style={styles.card} testID="aim-at-zone">
      <AppText variant="label">Aim at a zone</AppText>
      {zones.length > 1 ? (
        <Segmented<string>
          label="Zone"
          value={zone.id}
          onChange={setZoneId}
          options={zones.slice(0, 6).map((z) => ({ value: z.id, label: z.name, testID: `aim-zone-${z.id}` }))}
        />
      ) : null}
      <Button label={`Aim at ${zone.name}`} variant="secondary" testID="aim-at-zone-run" busy={busy} onPress={run} />
      {outcome ? (
        <AppText testID="aim-at-zone-outcome" role="status">
          {outcome}
        </AppText>
      ) : null}
      <Button
        label={comparing && comparing.of > 0 ? `Comparing ${comparing.done} of ${comparing.of} mirrors…` : 'Compare mirrors here'}
        variant="secondary"
        testID="size-for-zone-run"
        busy={comparing !== null}
        onPress={compare}
      />
      {shown && 'problem' in shown ? (
        <AppText testID="size-for-zone-problem" role="status">
          {shown.problem}
        </AppText>
      ) : null}
      {shown && !('problem' in shown) ? (
        <View style={styles.choices} testID="size-for-zone-choices" role="list">
          <AppText variant="small" tone="muted" role="status">
            {`Best catalogue mirrors at this mount for ${zone.name}, each at its best aim (now ${formatCoveredShare(shown.shareBefore)} seen).`}
          </AppText>
          {shown.choices.map((c, i) => {
            const isCurrent = current?.catalogueItemId === c.item.id && !current.customMirror;
            const ranged = zoneCriterion(zone) === 'detect' ? 'Noticed' : 'Recognised';
            return (
              <View key={c.item.id} style={styles.choice} role="listitem" testID={`size-choice-${c.item.id}`}>
                <AppText variant="label">{`${i + 1}. ${c.item.name}${isCurrent ? ' (this mirror)' : ''}`}</AppText>
                <AppText variant="small">
                  {`${formatCoveredShare(c.shareAfter)} of ${zone.name} seen · ${ranged} to ${formatRange(c.rangeM, p.units)} · ${formatMoney(c.item.unitPriceMinor, c.item.currency)}`}
                </AppText>
                <Button
                  label={isCurrent ? 'Use this aim' : 'Use this mirror'}
                  variant="secondary"
                  testID={`size-choice-use-${c.item.id}`}
                  onPress={() => {
                    p.onChoose(c.item.id, c.aim);
                    setSizing(null);
                    setOutcome(
                      `${c.item.name} set here: ${formatCoveredShare(shown.shareBefore)} → ${formatCoveredShare(c.shareAfter)} of ${zone.name} seen. Undo puts the mirror back as it was.`,
                    );
                  }}
                />
              </View>
            );
          })}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: palette.card,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.rule,
    padding: spacing.md,
    gap: spacing.sm,
  },
  choices: { gap: spacing.sm },
  choice: { gap: spacing.xs, paddingTop: spacing.sm, borderTopWidth: 1, borderTopColor: palette.rule },
});
