import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText, Button, Segmented, TextField } from '@/components/ui';
import { palette, radii, shadow, spacing } from '@/constants/theme';
import { unprintableMessage } from '@/shared/text/printable';

export type NewZoneTarget = 'adult' | 'child';

/** Names a zone just drawn; the default "Zone N" is fine to keep. */
export function ZoneNamePrompt({
  defaultName,
  error,
  onSave,
  onCancel,
}: {
  defaultName: string;
  error?: string;
  onSave: (name: string, target: NewZoneTarget) => void;
  onCancel: () => void;
}) {
  const [name, setName] = useState(defaultName);
  const [target, setTarget] = useState<NewZoneTarget>('adult');
  const trimmed = name.trim();
  const ok = trimmed !== '' && unprintableMessage(trimmed) === null;
  return (
    <View style={styles.card} testID="plan-zone-prompt" role="dialog" aria-label="Name the new zone">
      <AppText variant="heading">Name the zone</AppText>
      <TextField
        name="zoneName"
        label="Zone name"
        testID="plan-zone-name"
        value={name}
        onChangeText={setName}
        autoFocus
        selectTextOnFocus
        error={error ?? (trimmed ? (unprintableMessage(trimmed) ?? undefined) : 'Give the zone a name.')}
        onSubmitEditing={() => ok && onSave(trimmed, target)}
      />
      <Segmented<NewZoneTarget>
        label="Who must be seen here"
        value={target}
        onChange={setTarget}
        options={[
          { value: 'adult', label: 'Standing adult', testID: 'plan-zone-target-adult' },
          { value: 'child', label: 'Child', testID: 'plan-zone-target-child' },
        ]}
      />
      <View style={styles.row}>
        <Button label="Save zone" testID="plan-zone-save" onPress={() => onSave(trimmed, target)} disabled={!ok} />
        <Button label="Discard" variant="quiet" testID="plan-zone-discard" onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 2,
    borderColor: palette.asphalt,
    padding: spacing.lg,
    gap: spacing.md,
    ...shadow,
  },
  row: { flexDirection: 'row', gap: spacing.sm, alignItems: 'center' },
});
