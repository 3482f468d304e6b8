import { Formik } from 'formik';
import { useRef } from 'react';
import type { TextInput } from 'react-native';
import * as yup from 'yup';
import { Button, Notice, TextField } from '@/components/ui';
import { FormFrame } from './form-frame';
import { fieldMessage, serverErrorsFor, type FormStatus } from './server-errors';

export interface SetPasswordValues {
  password: string;
  confirm: string;
}

/** Mirrors the server's `newPassword` rule (10–72 characters: bcrypt reads at most 72 bytes). */
export const setPasswordSchema = yup.object({
  password: yup.string().required('Choose a password.').min(10, 'Use at least 10 characters.').max(72, 'Use at most 72 characters.'),
  confirm: yup
    .string()
    .required('Type the password again.')
    .oneOf([yup.ref('password')], 'The two passwords are not the same.'),
});

export interface SetPasswordFormProps {
  /** The invited address, shown read-only and offered to password managers as the user name. */
  email: string;
  onSubmit: (values: SetPasswordValues) => Promise<unknown>;
}

export function SetPasswordForm({ email, onSubmit }: SetPasswordFormProps) {
  const confirmRef = useRef<TextInput>(null);
  return (
    <Formik<SetPasswordValues>
      initialValues={{ password: '', confirm: '' }}
      validationSchema={setPasswordSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onSubmit(values);
        } catch (error) {
          const { fieldErrors, status } = serverErrorsFor<SetPasswordValues>(error, ['password', 'confirm'], values);
          helpers.setErrors(fieldErrors);
          helpers.setStatus(status);
        }
      }}
    >
      {(form) => {
        const { values, status, isSubmitting, handleChange, handleBlur, handleSubmit } = form;
        const formStatus = status as FormStatus | undefined;
        return (
          <FormFrame label="Choose your password" onSubmit={handleSubmit} testID="set-password-form">
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
            <TextField
              name="password"
              label="New password"
              hint="At least 10 characters. A short sentence is easy to remember and hard to guess."
              testID="set-password-password"
              value={values.password}
              onChangeText={handleChange('password')}
              onBlur={handleBlur('password')}
              error={fieldMessage(form, 'password')}
              secureTextEntry
              autoComplete="new-password"
              textContentType="newPassword"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="next"
              submitBehavior="submit"
              onSubmitEditing={() => confirmRef.current?.focus()}
            />
            <TextField
              ref={confirmRef}
              name="confirm"
              label="Type it again"
              testID="set-password-confirm"
              value={values.confirm}
              onChangeText={handleChange('confirm')}
              onBlur={handleBlur('confirm')}
              error={fieldMessage(form, 'confirm')}
              secureTextEntry
              autoComplete="new-password"
              textContentType="newPassword"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="go"
              onSubmitEditing={() => handleSubmit()}
            />
            {formStatus?.formError ? (
              <Notice tone="stop" testID="set-password-error">
                {formStatus.formError}
              </Notice>
            ) : null}
            <Button label="Save password and sign in" testID="set-password-submit" onPress={() => handleSubmit()} busy={isSubmitting} block />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
