/**
 * The project screen's two arrangements of the same parts. Wide: header and plan on the left, the
 * details panel on the right. Phone: header, the plan filling the screen with the tools at the
 * bottom, and the details in the bottom drawer; with the drawer open the tools step aside.
 */
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { PageTitle } from '@/components/ui/page-title';
import { palette, spacing } from '@/constants/theme';

/** The parts both layouts arrange. */
export interface WorkspaceParts {
  title: string;
  header: ReactNode;
  /** The canvas itself (fills the plan area). */
  canvas: ReactNode;
  /** Over the top of the plan: notices and the zone name prompt. */
  overPlan: ReactNode;
  toolbar: ReactNode;
  details: ReactNode;
}

function PlanArea({
  canvas,
  overPlan,
  toolbar,
  wide,
}: Pick<WorkspaceParts, 'canvas' | 'overPlan'> & { toolbar: ReactNode; wide: boolean }) {
  return (
    <View style={styles.planArea}>
      {canvas}
      <View style={[styles.overlayTop, wide && styles.overlayTopWide]} pointerEvents="box-none">
        {overPlan}
      </View>
      {toolbar ? (
        <View style={[styles.overlayBottom, wide && styles.overlayBottomWide]} pointerEvents="box-none">
          {toolbar}
        </View>
      ) : null}
    </View>
  );
}

export function WideWorkspace(p: WorkspaceParts) {
  return (
    <View style={styles.wideRoot}>
      <PageTitle title={p.title} />
      <View style={styles.wideMain}>
        {p.header}
        <PlanArea canvas={p.canvas} overPlan={p.overPlan} toolbar={p.toolbar} wide />
      </View>
      <ScrollView style={styles.panel} contentContainerStyle={styles.panelContent} testID="plan-panel">
        {p.details}
      </ScrollView>
    </View>
  );
}

export interface PhoneWorkspaceProps extends Omit<WorkspaceParts, 'details'> {
  drawerOpen: boolean;
  /** The bottom drawer, holding the details. */
  drawer: ReactNode;
}

export function PhoneWorkspace(p: PhoneWorkspaceProps) {
  return (
    <View style={styles.phoneRoot}>
      <PageTitle title={p.title} />
      {p.header}
      {/* With the drawer open the plan strip is short; the tools come back when it closes. */}
      <PlanArea canvas={p.canvas} overPlan={p.overPlan} toolbar={p.drawerOpen ? null : p.toolbar} wide={false} />
      {p.drawer}
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: palette.chalk },
  wideMain: { flex: 1 },
  phoneRoot: { flex: 1, backgroundColor: palette.chalk },
  planArea: { flex: 1, position: 'relative' },
  overlayTop: { position: 'absolute', top: spacing.sm, left: spacing.sm, right: spacing.sm + 56, gap: spacing.sm },
  overlayTopWide: { left: spacing.lg, right: 'auto', width: 440 },
  overlayBottom: { position: 'absolute', bottom: spacing.sm, left: spacing.sm, right: spacing.sm },
  overlayBottomWide: { left: spacing.lg, right: 'auto', width: 560 },
  panel: { width: 420, flexGrow: 0, borderLeftWidth: 1, borderLeftColor: palette.rule, backgroundColor: palette.chalk },
  panelContent: { padding: spacing.lg, gap: spacing.lg },
});
