import { Formik } from 'formik';
import { useRef } from 'react';
import type { TextInput } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { EmailField, PasswordField } from './credential-fields';
import { submitWithServerErrors } from './server-errors';
import { yupText } from './yup-rules';
import { currentPasswordRule, emailRule } from '@/shared/schemas/rules';

export interface SignInValues {
  email: string;
  password: string;
}

export const signInSchema = yup.object({
  email: yupText(emailRule),
  password: yupText(currentPasswordRule),
});

export interface SignInFormProps {
  /** Resolves when signed in; rejects with an ApiError whose message and fields are shown. */
  onSubmit: (values: SignInValues) => Promise<unknown>;
}

const initialValues: SignInValues = { email: '', password: '' };

export function SignInForm({ onSubmit }: SignInFormProps) {
  const passwordRef = useRef<TextInput>(null);
  return (
    <Formik<SignInValues>
      initialValues={initialValues}
      validationSchema={signInSchema}
      onSubmit={async (values, helpers) => {
        await submitWithServerErrors(helpers, ['email', 'password'], values, () =>
          onSubmit({ email: values.email.trim(), password: values.password }),
        );
      }}
    >
      {(form) => {
        const { values, handleSubmit } = form;
        return (
          <FormFrame label="Sign in" onSubmit={handleSubmit} testID="sign-in-form">
            <EmailField
              form={form}
              name="email"
              testID="sign-in-email"
              enterKeyHint="next"
              onSubmitEditing={() => {
                // Enter in the e-mail field moves on, unless a password manager already filled both.
                if (values.password) handleSubmit();
                else passwordRef.current?.focus();
              }}
              submitBehavior="submit"
            />
            <PasswordField
              form={form}
              inputRef={passwordRef}
              name="password"
              purpose="current"
              testID="sign-in-password"
              onSubmitEditing={() => handleSubmit()}
            />
            <FormFooter form={form} testIDPrefix="sign-in" submitLabel="Sign in" />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
