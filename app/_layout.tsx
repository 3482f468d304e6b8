import { QueryClientProvider } from '@tanstack/react-query';
import { Stack, type ErrorBoundaryProps } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useState } from 'react';
import { View, StyleSheet } from 'react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { Button, CenteredMessage } from '@/components/ui';
import { useAppFonts } from '@/constants/app-fonts';
import { palette } from '@/constants/theme';
import { makeQueryClient } from '@/hooks/query-client';
import { useSession } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

export default function RootLayout() {
  const [queryClient] = useState(makeQueryClient);
  // Web: never waits (faces swap in as they arrive); native: waits for the faces or their failure.
  const fontsReady = useAppFonts();
  return (
    <QueryClientProvider client={queryClient}>
      <SafeAreaProvider>
        <StatusBar style="light" />
        {fontsReady ? <RootNavigator /> : <View style={styles.blank} />}
      </SafeAreaProvider>
    </QueryClientProvider>
  );
}

/**
 * The one auth guard. `(app)` exists only while someone is signed in and `(auth)/sign-in` only
 * while nobody is; expo-router sends a person who asks for the other side to the first screen
 * they may see. set-password stays reachable either way: an invitation link can be opened anywhere.
 */
function RootNavigator() {
  const session = useSession();
  if (session.isPending) return <CenteredMessage loading title="Opening Sightfan…" testID="session-loading" />;
  if (session.error) {
    return (
      <CenteredMessage
        title="Sightfan could not check who is signed in"
        body={describeError(session.error)}
        testID="session-error"
        action={<Button label="Try again" testID="session-retry" onPress={() => void session.refetch()} />}
      />
    );
  }
  const signedIn = session.user !== null;
  return (
    <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: palette.chalk } }}>
      <Stack.Protected guard={!signedIn}>
        <Stack.Screen name="(auth)/sign-in" />
        <Stack.Screen name="(auth)/forgot-password" />
      </Stack.Protected>
      <Stack.Protected guard={signedIn}>
        <Stack.Screen name="(app)" />
      </Stack.Protected>
      <Stack.Screen name="(auth)/set-password" />
      <Stack.Screen name="+not-found" />
    </Stack>
  );
}

/** expo-router renders this in place of any route below that throws while rendering. */
export function ErrorBoundary({ error, retry }: ErrorBoundaryProps) {
  return (
    <CenteredMessage
      title="This screen stopped working"
      body={`${describeError(error)} Your data on the server is safe. Try again, or reload the page.`}
      testID="screen-crashed"
      action={<Button label="Try again" testID="crash-retry" onPress={() => void retry()} />}
    />
  );
}

const styles = StyleSheet.create({
  blank: { flex: 1, backgroundColor: palette.chalk },
});
