import { Pressable, StyleSheet } from 'react-native';
import { AppText } from '@/components/ui';
import { saveFile } from '@/components/sheet/save-file';
import { focusRing, layout, palette, radii, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { useOpenAttachmentMutation } from '@/hooks/use-outbox';
import { describeError } from '@/shared/errors';

export interface OutboxAttachmentProps {
  messageId: number;
  index: number;
  file: { filename: string; contentType: string; size: number };
}

/**
 * One attachment of an e-mail in the outbox (a specification sheet): pressing it opens the file the
 * buyer received. The name wraps on a phone instead of pushing the page sideways.
 */
export function OutboxAttachment({ messageId, index, file }: OutboxAttachmentProps) {
  const open = useOpenAttachmentMutation(saveFile);
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const label = `Open ${file.filename} (${Math.max(1, Math.ceil(file.size / 1024))} KB)`;
  return (
    <>
      <Pressable
        testID={`outbox-attachment-${messageId}-${index}`}
        role="button"
        aria-label={label}
        onPress={() => open.mutate({ messageId, index })}
        onFocus={onFocus}
        onBlur={onBlur}
        disabled={open.isPending}
        style={StyleSheet.flatten([styles.row, focusVisible && styles.focused])}
      >
        <AppText variant="bodyStrong" tone="glass" style={styles.text}>
          {open.isPending ? `Opening ${file.filename}…` : label}
        </AppText>
      </Pressable>
      {open.isError ? (
        <AppText variant="small" tone="stop" testID={`outbox-attachment-error-${messageId}-${index}`}>
          {describeError(open.error)}
        </AppText>
      ) : null}
    </>
  );
}

const styles = StyleSheet.create({
  row: {
    minHeight: layout.minTarget,
    justifyContent: 'center',
    paddingHorizontal: spacing.sm,
    borderRadius: radii.sm,
    borderWidth: 1,
    borderColor: palette.glass,
    backgroundColor: palette.glassSoft,
    // Never wider than the card: a long file name wraps (after its hyphens) inside it.
    maxWidth: '100%',
    flexShrink: 1,
  },
  focused: focusRing,
  text: { textDecorationLine: 'underline', flexShrink: 1 },
});
