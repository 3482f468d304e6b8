/**
 * The plan's tools, in one row at the bottom of the plan (thumb reach on a phone). Read-only
 * viewers get only Select: pan, zoom and picking still work.
 */
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText, Button, Segmented } from '@/components/ui';
import { layout, palette, radii, shadow, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import type { SceneWall } from '@/shared/schemas';
import type { PlanTool } from './plan-types';

const TOOLS: readonly { tool: PlanTool; label: string; a11y: string }[] = [
  { tool: 'select', label: 'Select', a11y: 'Select and move' },
  { tool: 'mirror', label: 'Mirror', a11y: 'Place a mirror' },
  { tool: 'viewer', label: 'Viewer', a11y: 'Place a viewer' },
  { tool: 'zone', label: 'Zone', a11y: 'Draw a zone' },
  { tool: 'wall', label: 'Wall', a11y: 'Draw a wall' },
];

const HINTS: Record<PlanTool, string> = {
  select: 'Drag a mirror or viewer to move it; drag the round handle to aim.',
  mirror: 'Tap where the mirror mounts.',
  viewer: 'Tap where the driver or pedestrian looks from.',
  zone: 'Tap each corner of the zone, then Finish.',
  wall: 'Tap both ends of the wall.',
};

export interface PlanToolbarProps {
  tool: PlanTool;
  onTool: (tool: PlanTool) => void;
  canEdit: boolean;
  canDelete: boolean;
  onDelete: () => void;
  zonePoints: number;
  onFinishZone: () => void;
  /** Drops the corners placed so far. */
  onCancelSketch: () => void;
  wallKind: SceneWall['kind'];
  onWallKind: (kind: SceneWall['kind']) => void;
  busy: boolean;
}

/** What a reviewer sees in place of the tools (the plan's and a vehicle's): read only, and what they can still do. */
export function ReadOnlyLines({ hint }: { hint: string }) {
  return (
    <>
      <AppText variant="label">Read only — you are reviewing</AppText>
      <AppText variant="small" tone="muted">
        {hint}
      </AppText>
    </>
  );
}

export function PlanToolbar(p: PlanToolbarProps) {
  if (!p.canEdit) {
    return (
      <View style={styles.readOnly} testID="plan-read-only" role="note">
        <ReadOnlyLines hint="Pan, zoom and tap items to see their numbers." />
        <ToolButton tool="select" label="Select" a11y="Select" active onPress={() => p.onTool('select')} />
      </View>
    );
  }
  return (
    <View style={styles.wrap} pointerEvents="box-none">
      {p.tool !== 'select' ? (
        <View style={styles.context} testID="plan-tool-context">
          <AppText variant="small" tone="muted" style={styles.hint} testID="plan-tool-hint">
            {p.tool === 'zone' && p.zonePoints > 0
              ? `${p.zonePoints} corner${p.zonePoints === 1 ? '' : 's'} placed. ${HINTS.zone}`
              : HINTS[p.tool]}
          </AppText>
          {p.tool === 'zone' ? (
            <View style={styles.row}>
              <Button label="Finish zone" testID="plan-zone-finish" onPress={p.onFinishZone} disabled={p.zonePoints < 3} />
              {p.zonePoints > 0 ? <Button label="Cancel" variant="quiet" testID="plan-sketch-cancel" onPress={p.onCancelSketch} /> : null}
            </View>
          ) : null}
          {p.tool === 'wall' ? (
            <Segmented<SceneWall['kind']>
              label="Kind of wall"
              value={p.wallKind}
              onChange={p.onWallKind}
              compact
              options={[
                { value: 'wall', label: 'Wall', testID: 'plan-wall-kind-wall' },
                { value: 'racking', label: 'Racking', testID: 'plan-wall-kind-racking' },
                { value: 'door', label: 'Door', testID: 'plan-wall-kind-door' },
              ]}
            />
          ) : null}
        </View>
      ) : null}
      <View style={styles.bar} role="toolbar" aria-label="Plan tools">
        {TOOLS.map((t) => (
          <ToolButton key={t.tool} {...t} active={p.tool === t.tool} onPress={() => p.onTool(t.tool)} />
        ))}
        <ToolButton
          tool="delete"
          label="Delete"
          a11y="Delete the selected item"
          active={false}
          disabled={!p.canDelete || p.busy}
          danger
          onPress={p.onDelete}
        />
      </View>
    </View>
  );
}

function ToolButton({
  tool,
  label,
  a11y,
  active,
  onPress,
  disabled,
  danger,
}: {
  tool: PlanTool | 'delete';
  label: string;
  a11y: string;
  active: boolean;
  onPress: () => void;
  disabled?: boolean;
  danger?: boolean;
}) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={tool === 'delete' ? 'plan-delete' : `plan-tool-${tool}`}
      role={tool === 'delete' ? 'button' : 'radio'}
      aria-checked={tool === 'delete' ? undefined : active}
      aria-label={a11y}
      aria-disabled={disabled}
      disabled={disabled}
      onPress={onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ hovered, pressed }) => [
        styles.tool,
        (hovered || pressed) && !active && styles.toolHover,
        active && styles.toolActive,
        disabled && styles.toolDisabled,
        focusVisible && styles.focus,
      ]}
    >
      <AppText
        variant="label"
        numberOfLines={1}
        style={[styles.toolText, active && styles.toolTextActive, danger && !disabled && styles.toolTextDanger]}
      >
        {label}
      </AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.sm },
  context: {
    backgroundColor: palette.card,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.rule,
    padding: spacing.sm,
    gap: spacing.sm,
    ...shadow,
  },
  hint: { paddingHorizontal: spacing.xs },
  row: { flexDirection: 'row', gap: spacing.sm, alignItems: 'center' },
  bar: { flexDirection: 'row', backgroundColor: palette.asphalt, borderRadius: radii.md, padding: 3, gap: 3, ...shadow },
  tool: {
    flex: 1,
    minHeight: layout.minTarget,
    minWidth: 52,
    borderRadius: radii.sm,
    alignItems: 'center',
    justifyContent: 'center',
    paddingHorizontal: spacing.xs,
  },
  toolHover: { backgroundColor: palette.asphaltRaised },
  toolActive: { backgroundColor: palette.beacon },
  toolDisabled: { opacity: 0.45 },
  focus: { outlineStyle: 'solid', outlineWidth: 3, outlineColor: palette.glassSoft, outlineOffset: -3 },
  toolText: { color: palette.onAsphalt, fontSize: 15 },
  toolTextActive: { color: palette.asphalt },
  toolTextDanger: { color: palette.stopSoft },
  readOnly: {
    backgroundColor: palette.card,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: palette.glass,
    padding: spacing.md,
    gap: spacing.xs,
    ...shadow,
  },
});
