import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { Stack, type ErrorBoundaryProps } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useEffect, useState, type ReactNode } from 'react';
import { View, StyleSheet } from 'react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { Button, CenteredMessage } from '@/components/ui';
import { useAppFonts } from '@/constants/app-fonts';
import { palette } from '@/constants/theme';
import { afterRestore, deviceCacheOptions, getDevicePersister, registerOfflineWrites, trackConnection } from '@/hooks/offline';
import { makeQueryClient } from '@/hooks/query-client';
import { markAppUpdated, registerServiceWorker } from '@/hooks/service-worker';
import { useSession } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

function makeAppQueryClient() {
  trackConnection();
  const client = makeQueryClient();
  registerOfflineWrites(client);
  return client;
}

export default function RootLayout() {
  const [queryClient] = useState(makeAppQueryClient);
  // Web: never waits (faces swap in as they arrive); native: waits for the faces or their failure.
  const fontsReady = useAppFonts();
  useEffect(() => registerServiceWorker(markAppUpdated), []);
  return (
    <DeviceCacheProvider client={queryClient}>
      <SafeAreaProvider>
        <StatusBar style="light" />
        {fontsReady ? <RootNavigator /> : <View style={styles.blank} />}
      </SafeAreaProvider>
    </DeviceCacheProvider>
  );
}

/** The query client, with its cache kept on the device where there is storage (hooks/offline.ts). */
function DeviceCacheProvider({ client, children }: { client: QueryClient; children: ReactNode }) {
  const persister = getDevicePersister();
  if (!persister) return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return (
    <PersistQueryClientProvider
      client={client}
      persistOptions={deviceCacheOptions(persister)}
      // Waiting changes are sent, then kept answers are asked for again (hooks/offline.ts).
      onSuccess={() => void afterRestore(client)}
    >
      {children}
    </PersistQueryClientProvider>
  );
}

/**
 * The one auth guard. `(app)` exists only while someone is signed in and `(auth)/sign-in` only
 * while nobody is; expo-router sends a person who asks for the other side to the first screen
 * they may see. set-password stays reachable either way: an invitation link can be opened anywhere.
 */
function RootNavigator() {
  const session = useSession();
  if (session.waitingForConnection) {
    return (
      <CenteredMessage
        title="Sightfan needs a connection once"
        body="Nobody has signed in on this device yet, so there is nothing kept here to work from. Sign in once with a connection; after that the catalogue and your recent jobs open here with no signal."
        testID="session-offline"
      />
    );
  }
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
