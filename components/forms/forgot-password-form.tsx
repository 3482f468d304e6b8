import { Formik } from 'formik';
import * as yup from 'yup';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { EmailField } from './credential-fields';
import { submitWithServerErrors, type FormStatus } from './server-errors';

export interface ForgotPasswordValues {
  email: string;
}

export const forgotPasswordSchema = yup.object({
  email: yup.string().trim().required('Enter your e-mail address.').email('Enter a full e-mail address, like name@company.com.'),
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
