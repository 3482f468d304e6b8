import { StyleSheet, View } from 'react-native';
import { AppText, Notice, Segmented } from '@/components/ui';
import { spacing } from '@/constants/theme';
import { useUpdateMeMutation } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';
import type { UnitSystem } from '@/shared/schemas';

const options = [
  { value: 'metric', label: 'Metric (m, mm)', testID: 'units-metric' },
  { value: 'imperial', label: 'Imperial (ft, in)', testID: 'units-imperial' },
] as const;

/** The units preference, saved on the user so it follows them to every device. */
export function UnitsControl({ units }: { units: UnitSystem }) {
  const update = useUpdateMeMutation();
  // Show the choice at once; the saved value takes over when the server answers.
  const shown = update.isPending && update.variables?.units ? update.variables.units : units;
  return (
    <View style={styles.column}>
      <Segmented<UnitSystem>
        label="Units"
        options={options}
        value={shown}
        disabled={update.isPending}
        onChange={(next) => update.mutate({ units: next })}
      />
      <AppText variant="small" tone="muted" aria-live="polite" testID="units-status">
        {update.isPending
          ? 'Saving…'
          : `Distances and heights are shown in ${units === 'metric' ? 'metres and millimetres' : 'feet and inches'}.`}
      </AppText>
      {update.isError ? (
        <Notice tone="stop" testID="units-error">
          {describeError(update.error)}
        </Notice>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
});
