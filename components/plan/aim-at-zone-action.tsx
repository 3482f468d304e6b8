/**
 * "Aim at this zone" for the selected mirror: choose a zone, press once, and the mirror is turned
 * (azimuth and tilt) to the aim the engine's sizing search finds best for that zone
 * (shared/project-optics/aim-at-zone.ts). The share before and after is shown; the turn is one
 * plan edit, so Undo turns it back. The search is bounded (AIM_CANDIDATES_MAX aims) and starts after
 * the busy state has been drawn, so the screen says it is working.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText, Button, Segmented } from '@/components/ui';
import { palette, radii, spacing } from '@/constants/theme';
import { aimAtZone, type AimAtZoneResult } from '@/shared/project-optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '@/shared/schemas';
import type { Aim } from '@/shared/optics';
import { formatCoveredShare } from './zone-quality';

export interface AimAtZoneActionProps {
  scene: Scene;
  placements: readonly PlacementDto[];
  catalogue: readonly CatalogueItemDto[];
  placementId: number;
  onAim: (aim: Aim) => void;
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
  const zone = zones.find((z) => z.id === zoneId) ?? zones[0];
  if (!zone) return null;

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
});
