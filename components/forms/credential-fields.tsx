/**
 * The fields every account form shares: an e-mail address, a password (current or new), and the
 * new password typed twice. One place for what the browser, password managers and the keyboard are
 * told (autofill kind, no capitals or corrections, which key moves on), so sign-in, "forgot
 * password", choosing a password from a link and changing it behave alike.
 */
import { useRef, type RefObject } from 'react';
import type { TextInput } from 'react-native';
import { FormikTextField, type FormikTextFieldProps, type TextFieldName } from './formik-text-field';

type FieldProps<Values extends object> = Omit<FormikTextFieldProps<Values>, 'label'> & { label?: string };

/**
 * An e-mail address: your own is filed by password managers as the account's user name; someone
 * else's (an invitation) is never filled in from yours.
 */
export function EmailField<Values extends object>({
  label = 'E-mail',
  someoneElses = false,
  ...props
}: FieldProps<Values> & { someoneElses?: boolean }) {
  return (
    <FormikTextField
      label={label}
      {...(someoneElses ? { autoComplete: 'off' as const } : { autoComplete: 'email' as const, textContentType: 'username' as const })}
      inputMode="email"
      keyboardType="email-address"
      autoCapitalize="none"
      autoCorrect={false}
      {...props}
    />
  );
}

export interface PasswordFieldProps<Values extends object> extends FieldProps<Values> {
  /** `current`: the password the account has (sign-in, proof before a change); `new`: one being chosen. */
  purpose: 'current' | 'new';
  /** The field Enter moves to; without it Enter submits (`onSubmitEditing`). */
  next?: RefObject<TextInput | null>;
}

export function PasswordField<Values extends object>({ purpose, next, label = 'Password', ...props }: PasswordFieldProps<Values>) {
  const moveOn = next
    ? { enterKeyHint: 'next' as const, submitBehavior: 'submit' as const, onSubmitEditing: () => next.current?.focus() }
    : {};
  return (
    <FormikTextField
      label={label}
      secureTextEntry
      autoComplete={purpose === 'current' ? 'current-password' : 'new-password'}
      textContentType={purpose === 'current' ? 'password' : 'newPassword'}
      autoCapitalize="none"
      autoCorrect={false}
      enterKeyHint="go"
      {...moveOn}
      {...props}
    />
  );
}

export interface NewPasswordPairProps<Values extends { password: string; confirm: string }> {
  form: FormikTextFieldProps<Values>['form'];
  /** Given to the first field, so an earlier field's Enter can move here. */
  inputRef?: RefObject<TextInput | null>;
  /** The two inputs' test ids. */
  testIDs: { password: string; confirm: string };
  labels?: { password: string; confirm: string };
  hint: string;
  /** Enter in the second field. */
  onDone: () => void;
}

/** The new password and the same again; the rules are the form's (newPasswordRule, passwordAgainRule). */
export function NewPasswordPair<Values extends { password: string; confirm: string }>({
  form,
  inputRef,
  testIDs,
  labels = { password: 'New password', confirm: 'Type it again' },
  hint,
  onDone,
}: NewPasswordPairProps<Values>) {
  const confirmRef = useRef<TextInput>(null);
  return (
    <>
      <PasswordField<Values>
        form={form}
        inputRef={inputRef}
        name={'password' as TextFieldName<Values>}
        purpose="new"
        label={labels.password}
        hint={hint}
        testID={testIDs.password}
        next={confirmRef}
      />
      <PasswordField<Values>
        form={form}
        inputRef={confirmRef}
        name={'confirm' as TextFieldName<Values>}
        purpose="new"
        label={labels.confirm}
        testID={testIDs.confirm}
        onSubmitEditing={onDone}
      />
    </>
  );
}
