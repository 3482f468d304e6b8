import { Formik } from 'formik';
import * as yup from 'yup';
import { TextField } from '@/components/ui';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { NewPasswordPair } from './credential-fields';
import { submitWithServerErrors } from './server-errors';
import { yupText, yupTextComparedTo } from './yup-rules';
import { newPasswordRule, passwordAgainRule, PASSWORDS_DIFFER } from '@/shared/schemas/rules';

export interface SetPasswordValues {
  password: string;
  confirm: string;
}

/** The server's rules (shared/schemas/rules.ts): 10–72 characters, since bcrypt reads at most 72 bytes. */
export const setPasswordSchema = yup.object({
  password: yupText(newPasswordRule),
  confirm: yupTextComparedTo(passwordAgainRule, 'password', 'same', PASSWORDS_DIFFER),
});

export interface SetPasswordFormProps {
  /** The invited address, shown read-only and offered to password managers as the user name. */
  email: string;
  onSubmit: (values: SetPasswordValues) => Promise<unknown>;
}

export function SetPasswordForm({ email, onSubmit }: SetPasswordFormProps) {
  return (
    <Formik<SetPasswordValues>
      initialValues={{ password: '', confirm: '' }}
      validationSchema={setPasswordSchema}
      onSubmit={async (values, helpers) => {
        await submitWithServerErrors(helpers, ['password', 'confirm'], values, () => onSubmit(values));
      }}
    >
      {(form) => {
        const { handleSubmit } = form;
        return (
          <FormFrame label="Choose your password" onSubmit={handleSubmit} testID="set-password-form">
            {/* Not a Formik field: the address is fixed, shown so password managers file the new password under it. */}
            <TextField
              name="username"
              label="E-mail"
              testID="set-password-email"
              value={email}
              editable={false}
              readOnly
              autoComplete="username"
              textContentType="username"
            />
            <NewPasswordPair
              form={form}
              testIDs={{ password: 'set-password-password', confirm: 'set-password-confirm' }}
              hint="At least 10 characters. A short sentence is easy to remember and hard to guess."
              onDone={() => handleSubmit()}
            />
            <FormFooter form={form} testIDPrefix="set-password" submitLabel="Save password and sign in" />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
