/**
 * The phone's bottom drawer for a vehicle job. Folded: the fields' shares and verdicts in one
 * glance, and the planning line with the cautions' gist, so neither is ever out of sight.
 * Unfolded: the details, scrolling, over the lower part of the top view.
 */
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View, useWindowDimensions } from 'react-native';
import { AppText } from '@/components/ui/text';
import { DrawerButton } from '@/components/plan/plan-drawer';
import { palette, radii, spacing } from '@/constants/theme';
import { SHORT_CAUTION } from '@/shared/cautions';
import type { VehicleEvaluation, VehiclePlacement } from '@/hooks/use-vehicle-evaluation';
import { formatFieldShare, verdictText } from '@/shared/project-optics';
import { fieldLabel } from './vehicle-words';

/**
 * "V passenger 98.5 % pass · IV passenger 5.4 % short · …": the fields the mirrors show most of
 * first, so the ones being worked on stay in the folded strip's lines.
 */
export function fieldsSummary(e: VehicleEvaluation | null): string {
  if (!e) return '';
  if (!e.score) return e.problem ?? '';
  if (e.score.fields.length === 0) return 'No ground fields under this rule set';
  return [...e.score.fields]
    .sort((a, b) => b.share - a.share)
    .map((s) => {
      const side = s.field.side === null ? '' : s.field.side === e.geometry.passengerSide ? ' passenger' : ' driver';
      return `${fieldLabel(s.field.code)}${side} ${formatFieldShare(s.share)} ${verdictText(s.verdict)}`;
    })
    .join(' · ');
}

export interface VehicleDrawerProps {
  open: boolean;
  onToggle: () => void;
  evaluation: VehicleEvaluation | null;
  selected: VehiclePlacement | undefined;
  children: ReactNode;
}

export function VehicleDrawer(p: VehicleDrawerProps) {
  const { height } = useWindowDimensions();
  return (
    <View style={[styles.drawer, p.open && { height: Math.round(height * 0.6) }]} testID="vehicle-drawer">
      <View style={styles.strip}>
        <View style={styles.grip} />
        <View style={styles.stripRow}>
          <View style={styles.stripText}>
            <AppText variant="label" numberOfLines={1} testID="vehicle-drawer-title">
              {p.selected ? `Mirror ${p.selected.label}` : 'Fields and verdicts'}
            </AppText>
            <AppText variant="small" tone="muted" numberOfLines={3} testID="vehicle-drawer-numbers">
              {fieldsSummary(p.evaluation)}
            </AppText>
          </View>
          <DrawerButton testID="vehicle-drawer-toggle" label={p.open ? 'Less' : 'Details'} expanded={p.open} onPress={p.onToggle} />
        </View>
        {/* Folded or not, the planning line and the short caution stay in view. */}
        <AppText variant="small" tone="stop" testID="vehicle-drawer-caution">
          {`Planning only: type approval and local rules decide. ${SHORT_CAUTION}`}
        </AppText>
      </View>
      {p.open ? (
        <ScrollView style={styles.body} contentContainerStyle={styles.bodyContent} testID="vehicle-drawer-body">
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
    paddingHorizontal: spacing.lg,
    paddingTop: spacing.xs,
    paddingBottom: spacing.sm,
    gap: spacing.xs,
  },
  grip: { alignSelf: 'center', width: 44, height: 5, borderRadius: 3, backgroundColor: palette.rule },
  stripRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  stripText: { flex: 1, minWidth: 0 },
  body: { flex: 1 },
  bodyContent: { padding: spacing.lg, paddingTop: spacing.xs, gap: spacing.lg },
});
