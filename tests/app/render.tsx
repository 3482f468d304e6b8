import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, type RenderResult } from '@testing-library/react';
import type { ReactElement } from 'react';

/** retry off so failures show at once; gcTime Infinity so no timer outlives the test (Jest would hang). */
export function makeTestQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: { queries: { retry: false, gcTime: Infinity }, mutations: { retry: false, gcTime: Infinity } },
  });
}

export function renderWithQuery(ui: ReactElement, client: QueryClient = makeTestQueryClient()): RenderResult & { client: QueryClient } {
  return { ...render(<QueryClientProvider client={client}>{ui}</QueryClientProvider>), client };
}
