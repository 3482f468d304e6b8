import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { FormStatus } from './server-errors';

/** What the footer reads from a Formik form (its `FormikProps`). */
export interface FooterForm {
  /** `formError` and the `done` sentence of the last submit (FormStatus). */
  status?: unknown;
  isSubmitting: boolean;
  handleSubmit: () => void;
}

export interface FormFooterProps {
  form: FooterForm;
  /** Test ids `<prefix>-error`, `<prefix>-done` and `<prefix>-submit`. */
  testIDPrefix: string;
  /** Test id of the `done` notice when it is not `<prefix>-done`. */
  doneTestID?: string;
  submitLabel: string;
  /** Further notices between the error and the button, e.g. "Invitation sent". */
  children?: ReactNode;
}

/** The end of every form: the one-sentence error or success from the last submit, any other notices, the submit button. */
export function FormFooter({ form, testIDPrefix, doneTestID, submitLabel, children }: FormFooterProps) {
  const status = form.status as FormStatus | undefined;
  return (
    <>
      {status?.formError ? (
        <Notice tone="stop" testID={`${testIDPrefix}-error`}>
          {status.formError}
        </Notice>
      ) : null}
      {status?.done ? (
        <Notice tone="go" testID={doneTestID ?? `${testIDPrefix}-done`}>
          {status.done}
        </Notice>
      ) : null}
      {children}
      <Button label={submitLabel} testID={`${testIDPrefix}-submit`} onPress={() => form.handleSubmit()} busy={form.isSubmitting} block />
    </>
  );
}
