import { AuthFrame } from '@/components/auth/auth-frame';
import { SignInForm } from '@/components/forms/sign-in-form';
import { useSignInMutation } from '@/hooks/use-session';

/** Signing in flips the root layout's guard, which then shows the signed-in app; nothing to navigate here. */
export default function SignInScreen() {
  const signIn = useSignInMutation();
  return (
    <AuthFrame title="Sign in" lead="Use the e-mail address your administrator invited.">
      <SignInForm onSubmit={(values) => signIn.mutateAsync(values)} />
    </AuthFrame>
  );
}
