import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { FormStatus } from './server-errors';

export interface FormFooterProps {
  /** Formik's `status`; its `formError` and its `done` sentence are shown above the button. */
  status: FormStatus | undefined;
  errorTestID: string;
  /** Test id of the `done` notice (a submit that succeeded and stays on the form). */
  doneTestID?: string;
  submitLabel: string;
  submitTestID: string;
  busy: boolean;
  onSubmit: () => void;
  /** Further notices between the error and the button, e.g. "Invitation sent". */
  children?: ReactNode;
}

/** The end of every form: the one-sentence error or success from the last submit, any other notices, the submit button. */
export function FormFooter({ status, errorTestID, doneTestID, submitLabel, submitTestID, busy, onSubmit, children }: FormFooterProps) {
  return (
    <>
      {status?.formError ? (
        <Notice tone="stop" testID={errorTestID}>
          {status.formError}
        </Notice>
      ) : null}
      {status?.done ? (
        <Notice tone="go" testID={doneTestID}>
          {status.done}
        </Notice>
      ) : null}
      {children}
      <Button label={submitLabel} testID={submitTestID} onPress={onSubmit} busy={busy} block />
    </>
  );
}
