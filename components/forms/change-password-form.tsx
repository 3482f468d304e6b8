import { Formik } from 'formik';
import { useRef } from 'react';
import type { TextInput } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { NewPasswordPair, PasswordField } from './credential-fields';
import { yupText, yupTextComparedTo } from './yup-rules';
import { submitWithServerErrors, type FormStatus } from './server-errors';
import { newPasswordAgainRule, newPasswordRule, oldPasswordRule, PASSWORD_UNCHANGED, PASSWORDS_DIFFER } from '@/shared/schemas/rules';

export interface ChangePasswordValues {
  currentPassword: string;
  password: string;
  confirm: string;
}

/** The shared rules (shared/schemas/rules.ts), as POST /auth/password checks them. */
export const changePasswordSchema = yup.object({
  currentPassword: yupText(oldPasswordRule),
  password: yupTextComparedTo(newPasswordRule, 'currentPassword', 'different', PASSWORD_UNCHANGED),
  confirm: yupTextComparedTo(newPasswordAgainRule, 'password', 'same', PASSWORDS_DIFFER),
});

const initialValues: ChangePasswordValues = { currentPassword: '', password: '', confirm: '' };
export const PASSWORD_CHANGED = 'Password changed. Anywhere else you were signed in has been signed out.';

export interface ChangePasswordFormProps {
  onSubmit: (values: ChangePasswordValues) => Promise<unknown>;
}

export function ChangePasswordForm({ onSubmit }: ChangePasswordFormProps) {
  const newRef = useRef<TextInput>(null);
  return (
    <Formik<ChangePasswordValues>
      initialValues={initialValues}
      validationSchema={changePasswordSchema}
      onSubmit={async (values, helpers) => {
        const ok = await submitWithServerErrors(helpers, ['currentPassword', 'password', 'confirm'], values, () => onSubmit(values));
        if (ok) helpers.resetForm({ values: initialValues, status: { done: PASSWORD_CHANGED } satisfies FormStatus });
      }}
    >
      {(form) => {
        const { handleSubmit } = form;
        return (
          <FormFrame label="Change your password" onSubmit={handleSubmit} testID="change-password-form">
            <PasswordField
              form={form}
              name="currentPassword"
              purpose="current"
              label="Current password"
              testID="change-password-current"
              next={newRef}
            />
            <NewPasswordPair
              form={form}
              inputRef={newRef}
              testIDs={{ password: 'change-password-new', confirm: 'change-password-confirm' }}
              labels={{ password: 'New password', confirm: 'Type the new password again' }}
              hint="At least 10 characters."
              onDone={() => handleSubmit()}
            />
            <FormFooter form={form} testIDPrefix="change-password" submitLabel="Change password" />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
