import { Formik } from 'formik';
import * as yup from 'yup';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { EmailField } from './credential-fields';
import { submitWithServerErrors, type FormStatus } from './server-errors';
import { yupText } from './yup-rules';
import { emailRule } from '@/shared/schemas/rules';

export interface ForgotPasswordValues {
  email: string;
}

/** The route's rule for the address (shared/schemas/rules.ts). */
export const forgotPasswordSchema = yup.object({
  email: yupText(emailRule),
});

export interface ForgotPasswordFormProps {
  /** Resolves with the server's sentence, which is the same whether or not the address has an account. */
  onSubmit: (values: ForgotPasswordValues) => Promise<{ message: string }>;
}

export function ForgotPasswordForm({ onSubmit }: ForgotPasswordFormProps) {
  return (
    <Formik<ForgotPasswordValues>
      initialValues={{ email: '' }}
      validationSchema={forgotPasswordSchema}
      onSubmit={async (values, helpers) => {
        let message = '';
        const ok = await submitWithServerErrors(helpers, ['email'], values, async () => {
          message = (await onSubmit({ email: values.email.trim() })).message;
        });
        if (ok) helpers.setStatus({ done: message } satisfies FormStatus);
      }}
    >
      {(form) => {
        const { handleSubmit } = form;
        return (
          <FormFrame label="Ask for a new password" onSubmit={handleSubmit} testID="forgot-password-form">
            <EmailField
              form={form}
              name="email"
              testID="forgot-password-email"
              enterKeyHint="send"
              onSubmitEditing={() => handleSubmit()}
            />
            <FormFooter form={form} testIDPrefix="forgot-password" submitLabel="E-mail me a link" />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
