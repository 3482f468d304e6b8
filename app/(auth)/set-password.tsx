import { Redirect, useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '@/components/auth/auth-frame';
import { InvitationState } from '@/components/auth/invitation-state';
import { SetPasswordForm } from '@/components/forms/set-password-form';
import { useAcceptInvitationMutation, useInvitationQuery, useSession } from '@/hooks/use-session';

/** Reached from the invitation e-mail: /set-password?token=… */
export default function SetPasswordScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  const { user } = useSession();
  const invitation = useInvitationQuery(token);
  const accept = useAcceptInvitationMutation();

  // Redirect on render, not in the submit handler: by now the root guard has re-rendered with the
  // new session, so "/" is open (navigating in the handler raced the guard and went nowhere).
  if (accept.isSuccess && user) return <Redirect href="/" />;

  return (
    <AuthFrame
      title={invitation.data?.purpose === 'reset' ? 'Choose a new password' : 'Choose your password'}
      lead={
        invitation.data
          ? invitation.data.purpose === 'reset'
            ? `${invitation.data.name}, choose a new password for ${invitation.data.organizationName}. Anywhere you were signed in will be signed out.`
            : `Welcome, ${invitation.data.name}. You are joining ${invitation.data.organizationName} on Sightfan.`
          : undefined
      }
    >
      <InvitationState token={token} query={invitation} signedInAs={user?.email}>
        {(found) => <SetPasswordForm email={found.email} onSubmit={(values) => accept.mutateAsync({ token: token ?? '', ...values })} />}
      </InvitationState>
    </AuthFrame>
  );
}
