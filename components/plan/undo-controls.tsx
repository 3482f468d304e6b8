/**
 * Undo and redo for the plan: two buttons beside the tools (thumb reach on a phone), and on a wide
 * screen Ctrl/Cmd+Z, Ctrl/Cmd+Shift+Z and Ctrl+Y, except while typing in a field (the field's own
 * undo wins there).
 */
import { useEffect, useLayoutEffect, useRef } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { AppText, Button } from '@/components/ui';
import { palette, radii, spacing } from '@/constants/theme';

export interface UndoControlsProps {
  canUndo: boolean;
  canRedo: boolean;
  onUndo: () => void;
  onRedo: () => void;
  /** A sentence when a step could not be undone (the plan changed elsewhere). */
  problem: string | null;
}

export function UndoControls(p: UndoControlsProps) {
  return (
    <View style={styles.wrap} pointerEvents="box-none">
      {p.problem ? (
        <View style={styles.problem} role="alert" testID="undo-problem">
          <AppText variant="small">{p.problem}</AppText>
        </View>
      ) : null}
      <View style={styles.row} pointerEvents="box-none">
        <Button label="Undo" variant="secondary" onPress={p.onUndo} disabled={!p.canUndo} testID="plan-undo" />
        <Button label="Redo" variant="secondary" onPress={p.onRedo} disabled={!p.canRedo} testID="plan-redo" />
      </View>
    </View>
  );
}

/** What a key press asks for, or null: Ctrl/Cmd+Z undoes, with Shift (or Ctrl+Y) redoes. Pure, for tests. */
export function undoKeyAction(e: {
  key: string;
  ctrlKey: boolean;
  metaKey: boolean;
  shiftKey: boolean;
  altKey: boolean;
}): 'undo' | 'redo' | null {
  if (!(e.ctrlKey || e.metaKey) || e.altKey) return null;
  const key = e.key.toLowerCase();
  if (key === 'z') return e.shiftKey ? 'redo' : 'undo';
  if (key === 'y' && e.ctrlKey && !e.shiftKey) return 'redo';
  return null;
}

const typingIn = (t: EventTarget | null) =>
  t instanceof HTMLElement && (t.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(t.tagName));

/** Binds the keyboard shortcuts on the web while `enabled`. */
export function useUndoKeys(enabled: boolean, onUndo: () => void, onRedo: () => void) {
  const latest = useRef({ onUndo, onRedo });
  useLayoutEffect(() => {
    latest.current = { onUndo, onRedo };
  });
  useEffect(() => {
    if (!enabled || Platform.OS !== 'web' || typeof window === 'undefined') return;
    const onKey = (e: KeyboardEvent) => {
      const action = undoKeyAction(e);
      if (!action || typingIn(e.target)) return;
      e.preventDefault();
      if (action === 'undo') latest.current.onUndo();
      else latest.current.onRedo();
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [enabled]);
}

const styles = StyleSheet.create({
  wrap: { alignItems: 'flex-end', gap: spacing.xs },
  row: { flexDirection: 'row', gap: spacing.sm },
  problem: {
    backgroundColor: palette.card,
    borderRadius: radii.md,
    padding: spacing.sm,
    borderWidth: 1,
    borderColor: palette.rule,
    maxWidth: 360,
  },
});
