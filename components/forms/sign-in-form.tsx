import { Formik } from 'formik';
import { useRef } from 'react';
import type { TextInput } from 'react-native';
import * as yup from 'yup';
import { FormFooter } from './form-footer';
import { FormFrame } from './form-frame';
import { FormikTextField } from './formik-text-field';
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
            <FormikTextField
              form={form}
              name="email"
              label="E-mail"
              testID="sign-in-email"
              autoComplete="email"
              textContentType="username"
              inputMode="email"
              keyboardType="email-address"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="next"
              onSubmitEditing={() => {
                // Enter in the e-mail field moves on, unless a password manager already filled both.
                if (values.password) handleSubmit();
                else passwordRef.current?.focus();
              }}
              submitBehavior="submit"
            />
            <FormikTextField
              form={form}
              inputRef={passwordRef}
              name="password"
              label="Password"
              testID="sign-in-password"
              secureTextEntry
              autoComplete="current-password"
              textContentType="password"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="go"
              onSubmitEditing={() => handleSubmit()}
            />
            <FormFooter
              status={form.status}
              errorTestID="sign-in-error"
              submitLabel="Sign in"
              submitTestID="sign-in-submit"
              busy={form.isSubmitting}
              onSubmit={() => handleSubmit()}
            />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
