import { Formik } from 'formik';
import { useRef } from 'react';
import type { TextInput } from 'react-native';
import * as yup from 'yup';
import { Button, Notice, TextField } from '@/components/ui';
import { FormFrame } from './form-frame';
import { fieldMessage, serverErrorsFor, type FormStatus } from './server-errors';

export interface SignInValues {
  email: string;
  password: string;
}

export const signInSchema = yup.object({
  email: yup.string().trim().required('Enter your e-mail address.').email('Enter a full e-mail address, like name@company.com.'),
  password: yup.string().required('Enter your password.'),
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
        helpers.setStatus(undefined);
        try {
          await onSubmit({ email: values.email.trim(), password: values.password });
        } catch (error) {
          const { fieldErrors, status } = serverErrorsFor<SignInValues>(error, ['email', 'password'], values);
          helpers.setErrors(fieldErrors);
          helpers.setStatus(status);
        }
      }}
    >
      {(form) => {
        const { values, status, isSubmitting, handleChange, handleBlur, handleSubmit } = form;
        const formStatus = status as FormStatus | undefined;
        return (
          <FormFrame label="Sign in" onSubmit={handleSubmit} testID="sign-in-form">
            <TextField
              name="email"
              label="E-mail"
              testID="sign-in-email"
              value={values.email}
              onChangeText={handleChange('email')}
              onBlur={handleBlur('email')}
              error={fieldMessage(form, 'email')}
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
            <TextField
              ref={passwordRef}
              name="password"
              label="Password"
              testID="sign-in-password"
              value={values.password}
              onChangeText={handleChange('password')}
              onBlur={handleBlur('password')}
              error={fieldMessage(form, 'password')}
              secureTextEntry
              autoComplete="current-password"
              textContentType="password"
              autoCapitalize="none"
              autoCorrect={false}
              enterKeyHint="go"
              onSubmitEditing={() => handleSubmit()}
            />
            {formStatus?.formError ? (
              <Notice tone="stop" testID="sign-in-error">
                {formStatus.formError}
              </Notice>
            ) : null}
            <Button label="Sign in" testID="sign-in-submit" onPress={() => handleSubmit()} busy={isSubmitting} block />
          </FormFrame>
        );
      }}
    </Formik>
  );
}
