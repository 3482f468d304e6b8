/**
 * The phone's bottom drawer as a frame, for the site plan and a vehicle job alike: a strip in
 * thumb reach (grip, a title, a line or more of numbers, the drawer's buttons) with the short
 * caution under it at every size, and, when open, the details scrolling below. What the strip
 * says, which sizes there are and what the buttons do belong to each screen's drawer.
 */
import type { ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, View, useWindowDimensions } from 'react-native';
import { AppText } from '@/components/ui/text';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';

/** The test ids of the drawer's parts (each screen keeps the ids its tests know). */
export interface DrawerTestIds {
  drawer: string;
  title: string;
  numbers: string;
  caution: string;
  body: string;
}

export interface DrawerFrameProps {
  /** The share of the window's height the open drawer takes; null when folded to the strip. */
  openShare: number | null;
  title: string;
  numbers: string;
  /** Lines of numbers the strip shows before it cuts them short. */
  numbersLines: number;
  /** The caution printed under the strip, whole, folded or not. */
  caution: string;
  buttons: ReactNode;
  testIds: DrawerTestIds;
  /** The details, shown only while open. */
  children: ReactNode;
}

export function DrawerFrame(p: DrawerFrameProps) {
  const { height } = useWindowDimensions();
  const open = p.openShare !== null;
  return (
    <View style={[styles.drawer, p.openShare !== null && { height: Math.round(height * p.openShare) }]} testID={p.testIds.drawer}>
      <View style={styles.strip}>
        <View style={styles.grip} />
        <View style={styles.stripRow}>
          <View style={styles.stripText}>
            <AppText variant="label" numberOfLines={1} testID={p.testIds.title}>
              {p.title}
            </AppText>
            <AppText variant="small" tone="muted" numberOfLines={p.numbersLines} testID={p.testIds.numbers}>
              {p.numbers}
            </AppText>
          </View>
          <View style={styles.buttons}>{p.buttons}</View>
        </View>
        {/* The screen shows coverage, so the short caution stays whole and in view at every size. */}
        <AppText variant="small" tone="stop" testID={p.testIds.caution}>
          {p.caution}
        </AppText>
      </View>
      {open ? (
        <ScrollView style={styles.body} contentContainerStyle={styles.bodyContent} testID={p.testIds.body}>
          {p.children}
        </ScrollView>
      ) : null}
    </View>
  );
}

/** A button whose name is its visible word (nothing else is replaced or hidden by pressing it). */
export function DrawerButton(p: { testID: string; label: string; expanded?: boolean; onPress: () => void }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={p.testID}
      role="button"
      aria-expanded={p.expanded}
      onPress={p.onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ pressed }) => [styles.button, pressed && styles.buttonPressed, focusVisible && focusRing]}
    >
      <AppText variant="label" tone="glass">
        {p.label}
      </AppText>
    </Pressable>
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
  buttons: { flexDirection: 'row', gap: spacing.xs },
  button: {
    minHeight: layout.minTarget,
    minWidth: layout.minTarget,
    paddingHorizontal: spacing.md,
    alignItems: 'center',
    justifyContent: 'center',
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.rule,
  },
  buttonPressed: { backgroundColor: palette.chalk },
  grip: { alignSelf: 'center', width: 44, height: 5, borderRadius: 3, backgroundColor: palette.rule },
  stripRow: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  stripText: { flex: 1, minWidth: 0 },
  body: { flex: 1 },
  bodyContent: { padding: spacing.lg, paddingTop: spacing.xs, gap: spacing.lg },
});
