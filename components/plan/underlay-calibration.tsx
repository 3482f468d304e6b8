/**
 * Calibrating the plan underlay on screen: the card over the plan that says which point to tap and
 * asks for the real distance, and the two tapped points drawn on the plan.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Circle, G, Line, Text as SvgText } from 'react-native-svg';
import { AppText, Button, TextField } from '@/components/ui';
import { fonts, palette, radii, shadow, spacing } from '@/constants/theme';
import { underlayToPlan } from '@/shared/geometry/underlay';
import type { Underlay } from '@/shared/schemas/files';
import type { UnitSystem } from '@/shared/units';
import { toScreen, type PairM, type PlanView } from './plan-view';

const EXAMPLE: Record<UnitSystem, string> = { metric: 'e.g. 3.8 m or 12 ft 6 in', imperial: 'e.g. 12 ft 6 in or 3.8 m' };

export interface CalibrationPromptProps {
  points: number;
  units: UnitSystem;
  /** Calibrates with the typed distance; answers the sentence that stops it, or null when done. */
  onSet: (distanceText: string) => string | null;
  onRestart: () => void;
  onCancel: () => void;
}

export function CalibrationPrompt({ points, units, onSet, onRestart, onCancel }: CalibrationPromptProps) {
  const [text, setText] = useState('');
  const [error, setError] = useState<string | null>(null);
  const step =
    points === 0
      ? 'Tap one end of a length you know: a wall, a door, a dimension line. Zoom in first for a sharp tap.'
      : points === 1
        ? 'Now tap the other end of that length.'
        : 'Type the real distance between the two points. Another tap moves point 2.';
  const submit = () => setError(onSet(text));
  return (
    <View style={styles.card} testID="underlay-calibration" role="dialog" aria-label="Calibrate the plan's scale">
      <View style={styles.head}>
        <AppText variant="label" style={styles.flex}>{`Calibrate the plan · step ${Math.min(points + 1, 3)} of 3`}</AppText>
        <Button label="Cancel" variant="quiet" testID="underlay-calibration-cancel" onPress={onCancel} />
      </View>
      <AppText variant="small" testID="underlay-calibration-step" aria-live="polite">
        {step}
      </AppText>
      {points >= 2 ? (
        <TextField
          name="underlayDistance"
          label="Real distance between the points"
          hint={EXAMPLE[units]}
          testID="underlay-calibration-distance"
          value={text}
          onChangeText={(t) => {
            setText(t);
            setError(null);
          }}
          autoFocus
          inputMode="decimal"
          autoCorrect={false}
          autoCapitalize="none"
          error={error ?? undefined}
          onSubmitEditing={submit}
        />
      ) : null}
      {points > 0 ? (
        <View style={styles.row}>
          {points >= 2 ? <Button label="Set the scale" testID="underlay-calibration-set" onPress={submit} /> : null}
          <Button label="Start again" variant="secondary" testID="underlay-calibration-restart" onPress={onRestart} />
        </View>
      ) : null}
    </View>
  );
}

/** The tapped points, numbered, and the line between them, in screen pixels for this view. */
export function CalibrationMarks({ underlay, pointsPx, view }: { underlay: Underlay; pointsPx: readonly PairM[]; view: PlanView }) {
  const pts = pointsPx.map((p) => toScreen(view, underlayToPlan(underlay, p)));
  return (
    <G pointerEvents="none" testID="underlay-calibration-marks">
      {pts.length === 2 ? (
        <Line x1={pts[0][0]} y1={pts[0][1]} x2={pts[1][0]} y2={pts[1][1]} stroke={palette.stop} strokeWidth={2.5} strokeDasharray="8 5" />
      ) : null}
      {pts.map(([x, y], i) => (
        <G key={i}>
          <Circle cx={x} cy={y} r={11} fill="none" stroke={palette.card} strokeWidth={5} />
          <Circle cx={x} cy={y} r={11} fill="none" stroke={palette.stop} strokeWidth={2.5} />
          <Line x1={x - 16} y1={y} x2={x + 16} y2={y} stroke={palette.stop} strokeWidth={1.5} />
          <Line x1={x} y1={y - 16} x2={x} y2={y + 16} stroke={palette.stop} strokeWidth={1.5} />
          <SvgText x={x + 14} y={y - 14} fontFamily={fonts.bold} fontSize={15} fill={palette.stop} stroke={palette.card} strokeWidth={0.5}>
            {String(i + 1)}
          </SvgText>
        </G>
      ))}
    </G>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 2,
    borderColor: palette.stop,
    paddingVertical: spacing.sm,
    paddingHorizontal: spacing.md,
    gap: spacing.xs,
    ...shadow,
  },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'center' },
  head: { flexDirection: 'row', gap: spacing.sm, alignItems: 'center' },
  flex: { flexGrow: 1, flexShrink: 1 },
});
