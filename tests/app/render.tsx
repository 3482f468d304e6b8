import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { PersistQueryClientProvider } from '@tanstack/react-query-persist-client';
import { render, type RenderResult } from '@testing-library/react';
import type { ReactElement, ReactNode } from 'react';
import { afterRestore, deviceCacheOptions, getDevicePersister, registerOfflineWrites } from '@/hooks/offline';
import type { UserDto } from '@/shared/schemas';

/** retry off so failures show at once; gcTime Infinity so no timer outlives the test (Jest would hang). */
export function makeTestQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: { queries: { retry: false, gcTime: Infinity }, mutations: { retry: false, gcTime: Infinity } },
  });
}

export function renderWithQuery(ui: ReactElement, client: QueryClient = makeTestQueryClient()): RenderResult & { client: QueryClient } {
  return { ...render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>), client };
}

/**
 * A fresh app start over the device's storage (jsdom's localStorage): a new client, the offline
 * writes registered, `keptSession` as the session the device remembers, the kept cache restored.
 */
export function startOnDevice(children: ReactNode, keptSession?: UserDto): { client: QueryClient; unmount: () => void } {
  const client = makeTestQueryClient();
  registerOfflineWrites(client);
  if (keptSession) client.setQueryData(['session', 'me'], keptSession);
  const persister = getDevicePersister(window.localStorage)!;
  const { unmount } = render(
    <PersistQueryClientProvider
      client={client}
      persistOptions={{ ...deviceCacheOptions(persister), throttleTime: 0 } as ReturnType<typeof deviceCacheOptions>}
      onSuccess={() => void afterRestore(client)}
    >
      {children}
    </PersistQueryClientProvider>,
  );
  return { client, unmount };
}
