/**
 * Choosing and sending one file: the chooser (a phone's camera at once for photos), a bar with the
 * share sent, Cancel while sending, and beside the control the reason a file was refused (checked on
 * the client first with the contract's sentences, else the server's own) with "Try again" when a
 * retry can help (a dropped connection, a server fault).
 */
import { StyleSheet, View } from 'react-native';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { palette, radii, spacing } from '@/constants/theme';
import type { FileDto, FileKind } from '@/shared/schemas/files';
import { FilePicker } from './file-picker';
import { useUpload, type UploadState } from './use-upload';
import type { SendOptions } from './upload-request';

export interface UploadControlProps {
  projectId: number;
  kind: FileKind;
  placementId?: number | null;
  page?: number | null;
  /** Prefix of every test id inside (`${testID}-progress`, `${testID}-cancel`, …). */
  testID: string;
  /** The chooser button's words ("Choose a plan"). A photo control also offers the camera. */
  chooseLabel: string;
  /** A photo control's camera button ("Take a photo"). */
  cameraLabel?: string;
  onUploaded: (file: FileDto) => void;
  disabled?: boolean;
  /** For tests: a stand-in for XMLHttpRequest. */
  makeRequest?: SendOptions['makeRequest'];
}

const ACCEPT: Record<FileKind, string> = {
  plan: 'image/png,image/jpeg,application/pdf',
  photo: 'image/png,image/jpeg',
};

/** "1.4 MB", "380 kB": what a person compares with a phone's photo sizes. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  return `${Math.max(1, Math.round(bytes / 1024))} kB`;
}

/** Whole per cent sent, never 100 before the server has answered. */
export function sharePercent(sent: number, total: number): number {
  if (!(total > 0)) return 0;
  return Math.min(99, Math.floor((sent / total) * 100));
}

export function UploadControl(props: UploadControlProps) {
  const { state, start, retry, cancel } = useUpload(props);
  const { testID } = props;
  const sending = state.phase === 'sending';

  return (
    <View style={styles.root} testID={testID}>
      {sending ? null : (
        <View style={styles.buttons}>
          {props.kind === 'photo' && props.cameraLabel ? (
            <FilePicker
              label={props.cameraLabel}
              testID={`${testID}-camera`}
              accept="image/*"
              camera
              onFile={start}
              disabled={props.disabled}
            />
          ) : null}
          <FilePicker
            label={props.chooseLabel}
            testID={`${testID}-choose`}
            accept={ACCEPT[props.kind]}
            variant={props.kind === 'photo' && props.cameraLabel ? 'secondary' : 'primary'}
            onFile={start}
            disabled={props.disabled}
          />
        </View>
      )}
      <UploadStatus state={state} testID={testID} onCancel={cancel} onRetry={retry} />
    </View>
  );
}

function UploadStatus({
  state,
  testID,
  onCancel,
  onRetry,
}: {
  state: UploadState;
  testID: string;
  onCancel: () => void;
  onRetry: () => void;
}) {
  if (state.phase === 'sending') {
    const pct = sharePercent(state.sent, state.total);
    return (
      <View style={styles.status}>
        <AppText variant="small" testID={`${testID}-progress-text`} aria-live="polite">
          {`Sending “${state.name}”: ${pct} % of ${formatBytes(state.total)}`}
        </AppText>
        <View
          style={styles.track}
          role="progressbar"
          aria-label={`Sending ${state.name}`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={pct}
          testID={`${testID}-progress`}
        >
          <View style={[styles.fill, { width: `${pct}%` }]} />
        </View>
        <Button label="Cancel" testID={`${testID}-cancel`} variant="secondary" onPress={onCancel} style={styles.cancel} />
      </View>
    );
  }
  if (state.phase === 'failed') {
    return (
      <View style={[styles.status, styles.failed]}>
        {/* Said next to the control and read out once (role alert); the focus stays where it was. */}
        <AppText variant="bodyStrong" tone="stop" role="alert" testID={`${testID}-error`}>
          {state.message}
        </AppText>
        {state.canRetry ? <Button label="Try again" testID={`${testID}-retry`} onPress={onRetry} style={styles.cancel} /> : null}
      </View>
    );
  }
  if (state.phase === 'cancelled') {
    return (
      <AppText variant="small" tone="muted" testID={`${testID}-cancelled`} aria-live="polite">
        {`Cancelled: “${state.name}” was not saved.`}
      </AppText>
    );
  }
  if (state.phase === 'done') {
    return (
      <AppText variant="small" tone="muted" testID={`${testID}-done`} aria-live="polite">
        {`Saved “${state.name}”.`}
      </AppText>
    );
  }
  return null;
}

const styles = StyleSheet.create({
  root: { gap: spacing.sm, alignSelf: 'stretch' },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  status: { gap: spacing.sm },
  failed: {
    padding: spacing.md,
    borderLeftWidth: 6,
    borderLeftColor: palette.stop,
    backgroundColor: palette.stopSoft,
    borderRadius: radii.sm,
  },
  track: { height: 14, borderRadius: radii.pill, backgroundColor: palette.ruleSoft, overflow: 'hidden' },
  fill: { height: 14, backgroundColor: palette.glass },
  cancel: { alignSelf: 'flex-start' },
});
