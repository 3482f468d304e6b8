/**
 * The phone's bottom drawer (not the PDF sheet). Collapsed: one strip with the selected item and its key numbers, in
 * thumb reach. Expanded: the details (editor or summary), scrolling, over the lower part of the plan.
 */
import type { ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, View, useWindowDimensions } from 'react-native';
import { AppText } from '@/components/ui';
import { layout, palette, radii, spacing } from '@/constants/theme';
import type { PlanEvaluation } from '@/hooks/use-plan-evaluation';
import { adultRangesText } from '@/shared/project-optics';
import type { PlacementDto, Scene } from '@/shared/schemas';
import { formatLength, type UnitSystem } from '@/shared/units';
import { formatCoveredShare } from '@/shared/zone-verdict';
import type { PlanSelection } from './plan-types';

export interface PlanDrawerProps {
  open: boolean;
  onToggle: () => void;
  selection: PlanSelection;
  placement: PlacementDto | undefined;
  scene: Scene;
  evaluation: PlanEvaluation | null;
  units: UnitSystem;
  children: ReactNode;
}

/** The collapsed strip's two lines: what is selected, and the numbers a person glances at. */
export function drawerSummary(p: Pick<PlanDrawerProps, 'selection' | 'placement' | 'scene' | 'evaluation' | 'units'>): {
  title: string;
  numbers: string;
} {
  const zones = p.scene.zones
    .map((z) => {
      const ev = p.evaluation?.zones.find((e) => e.zoneId === z.id);
      return `${z.name} ${formatCoveredShare(ev?.fraction ?? Number.NaN)}`;
    })
    .join(' · ');
  if (p.selection?.kind === 'placement' && p.placement) {
    const ev = p.evaluation?.placements.find((e) => e.placementId === p.placement!.id);
    const range = ev?.numbers ? adultRangesText(ev.numbers, (m) => formatLength(m, p.units)) : (ev?.problem?.message ?? '');
    return { title: p.placement.label, numbers: [range, zones].filter(Boolean).join(' · ') };
  }
  if (p.selection?.kind === 'viewer') {
    const v = p.scene.viewers.find((x) => x.id === p.selection!.id);
    if (v) return { title: v.name, numbers: `Eye ${formatLength(v.eyeHeightM, p.units)}` };
  }
  if (p.selection?.kind === 'zone') {
    const z = p.scene.zones.find((x) => x.id === p.selection!.id);
    const ev = p.evaluation?.zones.find((e) => e.zoneId === p.selection!.id);
    if (z) return { title: z.name, numbers: `${formatCoveredShare(ev?.fraction ?? Number.NaN)} covered` };
  }
  return { title: 'Project summary', numbers: zones || 'No zones yet' };
}

export function PlanDrawer(p: PlanDrawerProps) {
  const { height } = useWindowDimensions();
  const { title, numbers } = drawerSummary(p);
  return (
    <View style={[styles.drawer, p.open && { height: Math.round(height * 0.58) }]} testID="plan-drawer">
      <Pressable
        testID="drawer-toggle"
        role="button"
        aria-expanded={p.open}
        aria-label={p.open ? 'Show more of the plan' : 'Show details'}
        onPress={p.onToggle}
        style={({ pressed }) => [styles.strip, pressed && styles.stripPressed]}
      >
        <View style={styles.grip} />
        <View style={styles.stripRow}>
          <View style={styles.stripText}>
            <AppText variant="label" numberOfLines={1} testID="drawer-title">
              {title}
            </AppText>
            <AppText variant="small" tone="muted" numberOfLines={p.open ? 2 : 1} testID="drawer-numbers">
              {numbers}
            </AppText>
            {p.open ? null : (
              // The plan shows coverage, so the caution stays in view while the details are folded away.
              <AppText variant="small" tone="stop" numberOfLines={2} testID="drawer-caution">
                Mirrors show things smaller and farther away than they are. Read the cautions under Details.
              </AppText>
            )}
          </View>
          <AppText variant="label" tone="glass">
            {p.open ? 'Less ▾' : 'Details ▴'}
          </AppText>
        </View>
      </Pressable>
      {p.open ? (
        <ScrollView style={styles.body} contentContainerStyle={styles.bodyContent} testID="plan-drawer-body">
          {p.children}
        </ScrollView>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  drawer: {
    backgroundColor: palette.card,
    borderTopLeftRadius: radii.lg,
    borderTopRightRadius: radii.lg,
    borderTopWidth: 2,
    borderColor: palette.asphalt,
    boxShadow: '0 -4px 14px rgba(20,32,43,0.14)',
  },
  strip: {
    minHeight: layout.minTarget + 12,
    paddingHorizontal: spacing.lg,
    paddingTop: spacing.xs,
    paddingBottom: spacing.sm,
    gap: spacing.xs,
  },
  stripPressed: { backgroundColor: palette.chalk },
  grip: { alignSelf: 'center', width: 44, height: 5, borderRadius: 3, backgroundColor: palette.rule },
  stripRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  stripText: { flex: 1, minWidth: 0 },
  body: { flex: 1 },
  bodyContent: { padding: spacing.lg, paddingTop: spacing.xs, gap: spacing.lg },
});
