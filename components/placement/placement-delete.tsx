/** Removing a mirror: one button, then a confirmation that names it; a failure is said below. */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { AppText } from '@/components/ui/text';
import { palette, spacing } from '@/constants/theme';
import { describeError } from '@/shared/errors';

export interface PlacementDeleteProps {
  label: string;
  removing: boolean;
  /** Removes the mirror; a rejection's sentence is shown and the confirmation stays open. */
  onRemove: () => Promise<unknown>;
  onRemoved: () => void;
}

export function PlacementDelete({ label, removing, onRemove, onRemoved }: PlacementDeleteProps) {
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<unknown>(null);
  if (!confirming)
    return <Button label="Remove this mirror…" testID="placement-delete" variant="danger" onPress={() => setConfirming(true)} />;
  return (
    <View style={styles.confirm} testID="placement-delete-confirmation">
      <AppText variant="bodyStrong">{`Remove “${label}” from this project? This cannot be undone.`}</AppText>
      <View style={styles.actions}>
        <Button
          label="Remove mirror"
          testID="placement-delete-confirm"
          variant="danger"
          busy={removing}
          onPress={() => {
            setError(null);
            onRemove().then(onRemoved, setError);
          }}
        />
        <Button label="Keep it" testID="placement-delete-cancel" variant="secondary" onPress={() => setConfirming(false)} />
      </View>
      {error ? <Notice tone="stop">{describeError(error)}</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'center' },
  confirm: {
    gap: spacing.sm,
    padding: spacing.md,
    borderWidth: 2,
    borderColor: palette.stop,
    borderRadius: 8,
    backgroundColor: palette.stopSoft,
    alignSelf: 'stretch',
  },
});
