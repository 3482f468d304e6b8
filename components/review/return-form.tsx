import { Formik } from 'formik';
import { useRef } from 'react';
import type { TextInput } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from '@/components/forms/form-footer';
import { FormFrame } from '@/components/forms/form-frame';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { submitWithServerErrors } from '@/components/forms/server-errors';
import { yupText } from '@/components/forms/yup-rules';
import { reviewRules } from '@/shared/schemas';

export interface ReturnValues {
  reason: string;
}

/** Built from the same rule as the route's zod field, so the form refuses what the server refuses, in its words. */
export const returnSchema = yup.object({ reason: yupText(reviewRules.reason) });

export interface ReturnFormProps {
  onSubmit: (reason: string) => Promise<unknown>;
  /** Escape or the Cancel button: closes the form without sending. */
  onCancel?: () => void;
}

/**
 * Returning a job: at least one reason, kept with the job as a comment the installer answers.
 * Keyboard: the reason takes focus when the form opens; Ctrl+Enter (⌘+Enter) sends; Escape cancels.
 */
export function ReturnForm({ onSubmit, onCancel }: ReturnFormProps) {
  const reasonRef = useRef<TextInput>(null);
  return (
    <Formik<ReturnValues>
      initialValues={{ reason: '' }}
      validationSchema={returnSchema}
      onSubmit={async (values, helpers) => {
        const reason = values.reason.trim();
        if (await submitWithServerErrors(helpers, ['reason'], values, () => onSubmit(reason))) helpers.resetForm();
      }}
    >
      {(form) => (
        <FormFrame label="Return the job to the installer" onSubmit={form.handleSubmit} testID="return-form">
          <FormikTextField
            form={form}
            inputRef={reasonRef}
            name="reason"
            label="What must change before you can approve it"
            testID="return-reason"
            multiline
            numberOfLines={4}
            autoFocus
            onKeyPress={(e) => {
              const key = e.nativeEvent as { key: string; ctrlKey?: boolean; metaKey?: boolean };
              if (key.key === 'Enter' && (key.ctrlKey || key.metaKey)) form.handleSubmit();
              if (key.key === 'Escape') onCancel?.();
            }}
          />
          <FormFooter form={form} testIDPrefix="return" submitLabel={form.isSubmitting ? 'Returning…' : 'Return to the installer'} />
        </FormFrame>
      )}
    </Formik>
  );
}
