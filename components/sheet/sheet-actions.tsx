import { Formik } from 'formik';
import { useRef, useState } from 'react';
import { Linking, StyleSheet, View } from 'react-native';
import * as yup from 'yup';
import { AppText, Button, Notice, TextField } from '@/components/ui';
import { FormFrame } from '@/components/forms/form-frame';
import { fieldMessage, serverErrorsFor, type FormStatus } from '@/components/forms/server-errors';
import { yupText } from '@/components/forms/yup-rules';
import { spacing } from '@/constants/theme';
import { api } from '@/hooks/api';
import { useDownloadSheetMutation, useEmailSheetMutation, useIssueSheetMutation, useSheetStatusQuery } from '@/hooks/use-sheet';
import { describeError } from '@/shared/errors';
import type { SheetEmailBody, SheetStatusDto } from '@/shared/schemas';
import { sheetEmailRules } from '@/shared/schemas/rules';
import { isOutsideOrganisation, needsSendConfirmation, outsideWarning } from './outside-address';
import { canSaveFiles, saveFile } from './save-file';

export interface SheetEmailValues {
  to: string;
  note: string;
}

export const sheetEmailSchema = yup.object({
  to: yupText(sheetEmailRules.to),
  note: yupText(sheetEmailRules.note),
});

/** What the form sends; the route calls the note "message". */
export function sheetEmailBodyOf(values: SheetEmailValues): SheetEmailBody {
  return { to: values.to.trim(), message: values.note.trim() || undefined };
}

/** "Revision 3, issued 2026-12-02 by Ines Okafor" — or that none has been issued yet. */
export function revisionText(status: SheetStatusDto | undefined): string {
  if (!status) return 'Checking the sheet\u2019s revisions\u2026';
  const last = status.revisions[0];
  if (!last) return 'No sheet issued yet. Downloading or e-mailing it issues revision 1.';
  const issued = `Last issued: revision ${last.number}, ${last.issuedAt.slice(0, 10)}, by ${last.issuedBy}.`;
  return status.current.changedSinceLast
    ? `${issued} The project has changed since; the next sheet will be revision ${status.current.number}.`
    : issued;
}

export interface SheetActionsProps {
  projectId: number;
  /** Only changes the wording: anyone who can read the project may download and send its sheet. */
  canEdit: boolean;
}

/**
 * Download the specification sheet and e-mail it to a buyer, with the last issued revision.
 * Self-contained: fetches its own status; the project screen only places it.
 */
export function SheetActions({ projectId, canEdit }: SheetActionsProps) {
  const status = useSheetStatusQuery(projectId);
  const download = useDownloadSheetMutation(projectId, saveFile);
  const issue = useIssueSheetMutation(projectId);
  const email = useEmailSheetMutation(projectId);
  // The address the person has agreed to send an unapproved sheet to; a changed address asks again.
  const confirmedFor = useRef<string | null>(null);
  const [confirming, setConfirming] = useState<string | null>(null);
  const preparing = download.isPending || issue.isPending;
  const failed = download.error ?? issue.error;

  const onDownload = () => {
    if (canSaveFiles) download.mutate(undefined);
    else issue.mutate(undefined, { onSuccess: (issued) => void Linking.openURL(api.sheets.pdfPath(projectId, issued.revision.number)) });
  };

  return (
    <View style={styles.column} testID="sheet-actions">
      <AppText variant="caps">Specification sheet</AppText>
      <AppText testID="sheet-revision" tone="muted">
        {status.isError ? describeError(status.error) : revisionText(status.data)}
      </AppText>
      <AppText variant="small" tone="muted">
        {canEdit
          ? 'A PDF for the safety officer to sign and the buyer to attach to a purchase request.'
          : 'A PDF of this project as it stands; only the installer can change what is on it.'}
      </AppText>
      <Button
        label={preparing ? 'Preparing the sheet\u2026' : 'Download sheet'}
        testID="sheet-download"
        onPress={onDownload}
        busy={preparing}
        variant="secondary"
      />
      {failed ? (
        <Notice tone="stop" testID="sheet-download-error">
          {describeError(failed)}
        </Notice>
      ) : null}

      <Formik<SheetEmailValues>
        initialValues={{ to: '', note: '' }}
        validationSchema={sheetEmailSchema}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const to = values.to.trim();
          const approved = status.data?.current.approved;
          // Only an unapproved sheet asks; the server says whether the address leaves the organisation.
          if (approved !== true && confirmedFor.current !== to) {
            const outside = await isOutsideOrganisation(api, projectId, to);
            if (needsSendConfirmation(outside, approved)) {
              setConfirming(to);
              return;
            }
          }
          setConfirming(null);
          confirmedFor.current = null;
          try {
            const sent = await email.mutateAsync(sheetEmailBodyOf(values));
            helpers.resetForm();
            helpers.setStatus({
              done:
                sent.delivery === 'sent'
                  ? `Sheet revision ${sent.revision.number} sent to ${sent.to}.`
                  : `Sheet revision ${sent.revision.number} is queued for ${sent.to}: the mail server did not take it yet, and Sightfan keeps retrying.`,
            } satisfies FormStatus);
          } catch (error) {
            const mapped = serverErrorsFor<SheetEmailValues>(error, ['to', 'note'], values);
            const fields = error && typeof error === 'object' && 'fields' in error ? (error.fields as Record<string, string>) : {};
            // The server calls the note "message".
            if (fields.message) mapped.fieldErrors.note = fields.message;
            helpers.setErrors(mapped.fieldErrors);
            helpers.setStatus(mapped.status);
          }
        }}
      >
        {(form) => {
          const formStatus = form.status as FormStatus | undefined;
          return (
            <FormFrame label="E-mail the sheet" onSubmit={form.handleSubmit} testID="sheet-email-form">
              <TextField
                name="to"
                label="Buyer's e-mail"
                testID="sheet-email-to"
                value={form.values.to}
                onChangeText={form.handleChange('to')}
                onBlur={form.handleBlur('to')}
                error={fieldMessage(form, 'to')}
                inputMode="email"
                keyboardType="email-address"
                autoCapitalize="none"
                autoCorrect={false}
                autoComplete="email"
              />
              <TextField
                name="note"
                label="Note (optional)"
                testID="sheet-email-note"
                value={form.values.note}
                onChangeText={form.handleChange('note')}
                onBlur={form.handleBlur('note')}
                error={fieldMessage(form, 'note')}
                multiline
                numberOfLines={3}
              />
              {confirming && confirming === form.values.to.trim() ? (
                <Notice tone="stop" testID="sheet-email-confirm">
                  <AppText variant="bodyStrong" tone="stop">
                    {outsideWarning(confirming)}
                  </AppText>
                  <View style={styles.confirmRow}>
                    <Button
                      label="Send it anyway"
                      variant="danger"
                      testID="sheet-email-confirm-send"
                      onPress={() => {
                        confirmedFor.current = confirming;
                        form.handleSubmit();
                      }}
                    />
                    <Button label="Don't send" variant="quiet" testID="sheet-email-confirm-cancel" onPress={() => setConfirming(null)} />
                  </View>
                </Notice>
              ) : null}
              {formStatus?.formError ? (
                <Notice tone="stop" testID="sheet-email-error">
                  {formStatus.formError}
                </Notice>
              ) : null}
              {formStatus?.done ? (
                <Notice tone="go" testID="sheet-email-sent">
                  {formStatus.done}
                </Notice>
              ) : null}
              <Button
                label={form.isSubmitting ? 'Sending\u2026' : 'E-mail sheet'}
                testID="sheet-email-submit"
                onPress={() => form.handleSubmit()}
                busy={form.isSubmitting}
              />
            </FormFrame>
          );
        }}
      </Formik>
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
  confirmRow: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, marginTop: spacing.xs },
});
