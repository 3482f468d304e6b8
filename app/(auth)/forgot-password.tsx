import { Link } from 'expo-router';
import { StyleSheet } from 'react-native';
import { AuthFrame } from '@/components/auth/auth-frame';
import { ForgotPasswordForm } from '@/components/forms/forgot-password-form';
import { palette, spacing, type as typeScale } from '@/constants/theme';
import { useForgotPasswordMutation } from '@/hooks/use-session';

/** Signed out: ask for a one-time link to choose a new password. */
export default function ForgotPasswordScreen() {
  const forgot = useForgotPasswordMutation();
  return (
    <AuthFrame
      title="Forgot your password?"
      lead="Enter the address you sign in with. If it has an account, we e-mail a link to choose a new password."
    >
      <ForgotPasswordForm onSubmit={(values) => forgot.mutateAsync(values)} />
      <Link href="/sign-in" style={styles.back} testID="forgot-password-back">
        Back to sign-in
      </Link>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  back: {
    color: palette.glass,
    textDecorationLine: 'underline',
    fontFamily: typeScale.bodyStrong.fontFamily,
    marginTop: spacing.md,
    alignSelf: 'center',
  },
});
