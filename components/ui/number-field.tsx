import { useEffect, useRef, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { formatAngle, formatLength, parseAngle, parseLength, type LengthKind, type UnitSystem } from '@/shared/units';
import { numberProblem, type NumberRule } from '@/shared/schemas/rules';
import { AppText } from './text';
import { TextField } from './text-field';

export type NumberFieldKind = LengthKind | 'angle';

export interface NumberFieldProps {
  name: string;
  label: string;
  testID: string;
  units: UnitSystem;
  /** Lengths in metres, angles in radians: the field converts at its edge. */
  kind: NumberFieldKind;
  value: number | null;
  /** Called with SI on every keystroke that reads as a valid value, and on each stepper press. */
  onChangeValue: (value: number | null) => void;
  /** After the field loses focus (a good moment to save). */
  onCommitted?: () => void;
  error?: string;
  hint?: string;
  editable?: boolean;
  /** Shows − / + buttons that move the value by this much (SI). */
  step?: number;
  min?: number;
  max?: number;
  precision?: number;
  /** Say so on blur when the field is left empty (the last valid value is kept meanwhile). */
  required?: boolean;
  /**
   * The route's rule for this value, with its sentences in the reader's units (shared/schemas/rules.ts).
   * A typed value that breaks it is said at once and never sent; the last valid value is kept.
   */
  rule?: NumberRule;
}

function formatValue(v: number | null, kind: NumberFieldKind, units: UnitSystem, precision?: number): string {
  if (v === null || !Number.isFinite(v)) return '';
  if (kind === 'angle') return formatAngle(v, { precision });
  return formatLength(v, units, { kind, precision });
}

function parseValue(text: string, kind: NumberFieldKind, units: UnitSystem): { ok: true; value: number } | { ok: false; message: string } {
  if (kind === 'angle') {
    const r = parseAngle(text);
    return r.ok ? { ok: true, value: r.rad } : r;
  }
  const r = parseLength(text, units, kind);
  return r.ok ? { ok: true, value: r.m } : r;
}

function unitHint(kind: NumberFieldKind, units: UnitSystem): string {
  if (kind === 'angle') return 'Degrees.';
  if (units === 'metric')
    return kind === 'size' ? 'Millimetres unless you type a unit (also "24 in").' : 'Metres unless you type a unit (also "10 ft 6 in").';
  return kind === 'size' ? 'Inches unless you type a unit (also "600 mm").' : 'Feet unless you type a unit (also "3.2 m").';
}

/**
 * A number with units, typed as a person says it ("2 ft 3 in", "600 mm") in either system. The
 * text the person typed is kept as typed while they edit (never rewritten under their thumb); it
 * is tidied into the current units only on blur or when the value changes from outside.
 */
export function NumberField({
  name,
  label,
  testID,
  units,
  kind,
  value,
  onChangeValue,
  onCommitted,
  error,
  hint,
  editable = true,
  step,
  min,
  max,
  precision,
  required = true,
  rule,
}: NumberFieldProps) {
  const [text, setText] = useState(() => formatValue(value, kind, units, precision));
  const [parseError, setParseError] = useState<string | undefined>();
  const focused = useRef(false);
  const lastEmitted = useRef<number | null>(value);

  // Follow outside changes (a 409 reload, a stepper, a units switch) unless the person is typing.
  useEffect(() => {
    if (focused.current && value === lastEmitted.current) return;
    setText(formatValue(value, kind, units, precision));
    setParseError(undefined);
    lastEmitted.current = value;
  }, [value, kind, units, precision]);

  const emit = (v: number | null) => {
    lastEmitted.current = v;
    onChangeValue(v);
  };

  const onChangeText = (t: string) => {
    setText(t);
    if (t.trim() === '') {
      emit(null);
      return;
    }
    const r = parseValue(t, kind, units);
    if (!r.ok) return;
    const problem = rule ? numberProblem(rule, r.value) : null;
    setParseError(problem ?? undefined);
    if (!problem) emit(r.value);
  };

  const onBlur = () => {
    focused.current = false;
    if (text.trim() !== '') {
      const r = parseValue(text, kind, units);
      const problem = r.ok ? (rule ? numberProblem(rule, r.value) : null) : r.message;
      // A value the rule refuses stays as typed beside its sentence, so the person sees what was refused.
      if (problem) setParseError(problem);
      else if (r.ok) setText(formatValue(r.value, kind, units, precision));
    } else if (required) {
      setParseError(`Enter the ${label.toLowerCase()}.`);
    }
    onCommitted?.();
  };

  const clamp = (v: number) => Math.min(max ?? Infinity, Math.max(min ?? -Infinity, v));
  const stepBy = (sign: 1 | -1) => {
    if (step === undefined) return;
    const next = clamp((value ?? min ?? 0) + sign * step);
    // Keep to the step's grain so repeated presses do not drift by floating-point dust.
    const snapped = Math.round(next / step) * step;
    setText(formatValue(snapped, kind, units, precision));
    setParseError(undefined);
    emit(snapped);
    onCommitted?.();
  };

  const field = (
    <TextField
      name={name}
      label={label}
      testID={testID}
      value={text}
      onChangeText={onChangeText}
      onFocus={() => {
        focused.current = true;
      }}
      onBlur={onBlur}
      onSubmitEditing={onBlur}
      editable={editable}
      error={parseError ?? error}
      hint={hint ?? (editable ? unitHint(kind, units) : undefined)}
      inputMode="text"
      autoCapitalize="none"
      autoCorrect={false}
    />
  );

  if (step === undefined || !editable) return field;
  return (
    <View style={styles.row}>
      <View style={styles.grow}>{field}</View>
      <View style={styles.steppers}>
        <Stepper label="−" a11y={`Decrease ${label.toLowerCase()}`} testID={`${testID}-minus`} onPress={() => stepBy(-1)} />
        <Stepper label="+" a11y={`Increase ${label.toLowerCase()}`} testID={`${testID}-plus`} onPress={() => stepBy(1)} />
      </View>
    </View>
  );
}

function Stepper({ label, a11y, testID, onPress }: { label: string; a11y: string; testID: string; onPress: () => void }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  return (
    <Pressable
      testID={testID}
      role="button"
      aria-label={a11y}
      onPress={onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ pressed, hovered }) => [styles.stepper, (pressed || hovered) && styles.stepperPressed, focusVisible && focusRing]}
    >
      <AppText variant="heading">{label}</AppText>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'flex-end', gap: spacing.sm },
  grow: { flex: 1 },
  steppers: { flexDirection: 'row', gap: spacing.xs, paddingBottom: 0 },
  stepper: {
    // A thumb is wider than a fingertip: a little over the 48 px minimum both ways.
    width: layout.minTarget + 8,
    height: layout.minTarget + 4,
    borderRadius: radii.md,
    borderWidth: 2,
    borderColor: palette.asphalt,
    backgroundColor: palette.card,
    alignItems: 'center',
    justifyContent: 'center',
  },
  stepperPressed: { backgroundColor: palette.ruleSoft },
});
