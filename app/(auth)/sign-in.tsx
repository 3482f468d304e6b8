import { Link } from 'expo-router';
import { StyleSheet } from 'react-native';
import { AuthFrame } from '@/components/auth/auth-frame';
import { palette, spacing, type as typeScale } from '@/constants/theme';
import { SignInForm } from '@/components/forms/sign-in-form';
import { useSignInMutation } from '@/hooks/use-session';

/** Signing in flips the root layout's guard, which then shows the signed-in app; nothing to navigate here. */
export default function SignInScreen() {
  const signIn = useSignInMutation();
  return (
    <AuthFrame title="Sign in" lead="Use the e-mail address your administrator invited.">
      <SignInForm onSubmit={(values) => signIn.mutateAsync(values)} />
      <Link href="/forgot-password" style={styles.forgot} testID="sign-in-forgot">
        Forgot your password?
      </Link>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  forgot: {
    color: palette.glass,
    textDecorationLine: 'underline',
    fontFamily: typeScale.bodyStrong.fontFamily,
    marginTop: spacing.md,
    alignSelf: 'center',
  },
});
