import { Formik } from 'formik';
import { useRef } from 'react';
import type { TextInput } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { FormikTextField } from './formik-text-field';
import { setPasswordSchema } from './set-password-form';
import { submitWithServerErrors, type FormStatus } from './server-errors';

export interface ChangePasswordValues {
  currentPassword: string;
  password: string;
  confirm: string;
}

/** The new-password rules are the set-password form's (they mirror the server's `newPassword`). */
export const changePasswordSchema = setPasswordSchema.shape({
  currentPassword: yup.string().required('Enter your current password.'),
  password: yup
    .string()
    .required('Choose a password.')
    .min(10, 'Use at least 10 characters.')
    .max(72, 'Use at most 72 characters.')
    .notOneOf([yup.ref('currentPassword')], 'Choose a password different from the current one.'),
});

const initialValues: ChangePasswordValues = { currentPassword: '', password: '', confirm: '' };
export const PASSWORD_CHANGED = 'Password changed. Anywhere else you were signed in has been signed out.';

export interface ChangePasswordFormProps {
  onSubmit: (values: ChangePasswordValues) => Promise<unknown>;
}

export function ChangePasswordForm({ onSubmit }: ChangePasswordFormProps) {
  const newRef = useRef<TextInput>(null);
  const confirmRef = useRef<TextInput>(null);
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
        const status = form.status as FormStatus | undefined;
        return (
          <FormFrame label="Change your password" onSubmit={handleSubmit} testID="change-password-form">
            <FormikTextField
              form={form}
              name="currentPassword"
              label="Current password"
              testID="change-password-current"
              secureTextEntry
              autoComplete="current-password"
              textContentType="password"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => newRef.current?.focus()}
            />
            <FormikTextField
              form={form}
              inputRef={newRef}
              name="password"
              label="New password"
              hint="At least 10 characters."
              testID="change-password-new"
              secureTextEntry
              autoComplete="new-password"
              textContentType="newPassword"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => confirmRef.current?.focus()}
            />
            <FormikTextField
              form={form}
              inputRef={confirmRef}
              name="confirm"
              label="Type the new password again"
              testID="change-password-confirm"
              secureTextEntry
              autoComplete="new-password"
              textContentType="newPassword"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="go"
              onSubmitEditing={() => handleSubmit()}
            />
            <FormFooter
              status={status}
              errorTestID="change-password-error"
              submitLabel="Change password"
              submitTestID="change-password-submit"
              busy={form.isSubmitting}
              doneTestID="change-password-done"
              onSubmit={() => handleSubmit()}
            />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
