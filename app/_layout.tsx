import { QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Stack, type ErrorBoundaryProps } from 'expo-router';
import { StatusBar } from 'expo-status-bar';
import { useState } from 'react';
import { View, StyleSheet } from 'react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { Button, CenteredMessage } from '@/components/ui';
import { fonts, palette } from '@/constants/theme';
import { makeQueryClient } from '@/hooks/query-client';
import { useSession } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';

/** The same TTF files the PDF renderer embeds, registered under the names constants/theme.ts uses. */
const fontFiles = {
  [fonts.regular]: require('@/fonts/Barlow-Regular.ttf'),
  [fonts.medium]: require('@/fonts/Barlow-Medium.ttf'),
  [fonts.semibold]: require('@/fonts/Barlow-SemiBold.ttf'),
  [fonts.bold]: require('@/fonts/Barlow-Bold.ttf'),
  [fonts.mono]: require('@/fonts/JetBrainsMono-Regular.ttf'),
  [fonts.monoMedium]: require('@/fonts/JetBrainsMono-Medium.ttf'),
};

export default function RootLayout() {
  const [queryClient] = useState(makeQueryClient);
  const [fontsLoaded, fontError] = useFonts(fontFiles);
  return (
    <QueryClientProvider client={queryClient}>
      <SafeAreaProvider>
        <StatusBar style="light" />
        {/* A failed font load falls back to system type rather than blocking sign-in. */}
        {fontsLoaded || fontError ? <RootNavigator /> : <View style={styles.blank} />}
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
