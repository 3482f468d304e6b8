import type { UseQueryResult } from '@tanstack/react-query';
import { Link } from 'expo-router';
import type { ReactNode } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { AppText, Notice } from '@/components/ui';
import { palette, spacing } from '@/constants/theme';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';
import type { InvitationDto } from '@/shared/schemas';

export interface InvitationStateProps {
  token: string | undefined;
  query: UseQueryResult<InvitationDto>;
  /** Set when someone is already signed in in this browser. */
  signedInAs?: string;
  children: (invitation: InvitationDto) => ReactNode;
}

/** The states of an invitation link before its form can be shown: missing, checking, gone, found. */
export function InvitationState({ token, query, signedInAs, children }: InvitationStateProps) {
  if (!token) {
    return (
      <Notice tone="stop" testID="invitation-missing">
        This link is missing its code. Open the link in your invitation e-mail again, or ask your administrator to send a new invitation.
      </Notice>
    );
  }
  if (query.isPending) {
    return (
      <View style={styles.row} testID="invitation-loading">
        <ActivityIndicator color={palette.glass} />
        <AppText tone="muted">Checking your invitation…</AppText>
      </View>
    );
  }
  if (query.isError) {
    const gone = query.error instanceof ApiError && (query.error.status === 404 || query.error.status === 410);
    return (
      <View style={styles.column}>
        <Notice tone="stop" testID="invitation-error">
          {describeError(query.error)}
        </Notice>
        {gone ? (
          <AppText tone="muted">
            An invitation works once and for a limited time. Ask your administrator to invite you again; if you already chose a password,{' '}
            <Link href="/sign-in" testID="invitation-sign-in">
              <AppText tone="glass" variant="bodyStrong">
                sign in
              </AppText>
            </Link>
            .
          </AppText>
        ) : null}
      </View>
    );
  }
  return (
    <View style={styles.column}>
      {signedInAs && signedInAs !== query.data.email ? (
        <Notice tone="info" testID="invitation-other-session">
          {`You are signed in as ${signedInAs} in this browser. Saving this password signs you in as ${query.data.email} instead.`}
        </Notice>
      ) : null}
      {children(query.data)}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.md },
  column: { gap: spacing.lg },
});
