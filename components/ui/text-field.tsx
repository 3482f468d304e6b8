import { forwardRef, useState } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { layout, palette, radii, spacing, type as typeScale } from '@/constants/theme';
import { AppText } from './text';

export interface TextFieldProps extends Omit<TextInputProps, 'style' | 'id' | 'nativeID'> {
  /** The form field's name: used for DOM ids and for the `field-error-<name>` test id. */
  name: string;
  label: string;
  testID: string;
  error?: string;
  hint?: string;
}

/**
 * A labelled input with its message right under it. The label and message are tied to the input
 * by id (aria-labelledby / aria-describedby), so screen readers and `getByLabelText` find them.
 */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { name, label, testID, error, hint, onFocus, onBlur, ...inputProps },
  ref,
) {
  // A strong focus border: the browser's thin default outline is hard to see in daylight.
  const [focused, setFocused] = useState(false);
  const readOnly = inputProps.editable === false;
  const inputId = `field-${name}`;
  const labelId = `${inputId}-label`;
  const messageId = `${inputId}-message`;
  return (
    <View style={styles.field}>
      <AppText variant="label" nativeID={labelId}>
        {label}
      </AppText>
      {hint ? (
        <AppText variant="small" tone="muted">
          {hint}
        </AppText>
      ) : null}
      <TextInput
        ref={ref}
        {...inputProps}
        id={inputId}
        testID={testID}
        aria-labelledby={labelId}
        aria-describedby={error ? messageId : undefined}
        aria-invalid={Boolean(error)}
        onFocus={(event) => {
          setFocused(true);
          onFocus?.(event);
        }}
        onBlur={(event) => {
          setFocused(false);
          onBlur?.(event);
        }}
        placeholderTextColor={palette.haze}
        style={[
          styles.input,
          readOnly && styles.inputReadOnly,
          error ? styles.inputError : null,
          focused && !readOnly && styles.inputFocused,
        ]}
      />
      {error ? (
        <AppText variant="small" tone="stop" nativeID={messageId} testID={`field-error-${name}`} aria-live="polite">
          {error}
        </AppText>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  field: { gap: spacing.xs, alignSelf: 'stretch' },
  input: {
    ...typeScale.body,
    color: palette.asphalt,
    minHeight: layout.minTarget + 4,
    paddingHorizontal: spacing.md,
    backgroundColor: palette.card,
    borderWidth: 2,
    borderColor: palette.rule,
    borderRadius: radii.md,
  },
  inputReadOnly: { backgroundColor: palette.chalk, borderColor: palette.ruleSoft },
  inputFocused: { borderColor: palette.glass, outlineStyle: 'solid', outlineWidth: 2, outlineColor: palette.glass, outlineOffset: 0 },
  inputError: { borderColor: palette.stop, backgroundColor: palette.stopSoft },
});
