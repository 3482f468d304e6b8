/** Said in the app shell once a newer build of Sightfan has taken over (a deploy while it was open). */
import { StyleSheet, View } from 'react-native';
import { AppText, Button } from '@/components/ui';
import { palette, spacing } from '@/constants/theme';
import { useAppUpdated } from '@/hooks/service-worker';

export function UpdateNotice() {
  const updated = useAppUpdated();
  if (!updated) return null;
  return (
    <View style={styles.band} role="status" aria-live="polite" testID="app-updated">
      <AppText variant="small" style={styles.text}>
        A new version of Sightfan is ready. Reload to use it; changes waiting for a connection are kept.
      </AppText>
      <Button label="Reload" variant="secondary" testID="app-updated-reload" onPress={() => window.location.reload()} />
    </View>
  );
}

const styles = StyleSheet.create({
  band: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.sm,
    backgroundColor: palette.beaconSoft,
    borderBottomWidth: 1,
    borderBottomColor: palette.beacon,
  },
  text: { flex: 1 },
});
