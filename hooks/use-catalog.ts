/** The mirror catalogue: everyone reads it, the admin edits it. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateCatalogueItemBody, PatchCatalogueItemBody } from '@/shared/schemas';
import { api } from './api';

/** The catalogue changes rarely; five minutes keeps pickers quick on a poor connection. */
export const CATALOG_STALE_MS = 5 * 60_000;

export const catalogKeys = {
  all: ['catalog'] as const,
  list: () => [...catalogKeys.all, 'list'] as const,
};

export function useCatalogQuery() {
  return useQuery({ queryKey: catalogKeys.list(), queryFn: async () => (await api.catalog.list()).items, staleTime: CATALOG_STALE_MS });
}

export function useCreateCatalogItemMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateCatalogueItemBody) => api.catalog.create(body),
    onSuccess: () => void qc.invalidateQueries({ queryKey: catalogKeys.all }),
  });
}

export function useUpdateCatalogItemMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: PatchCatalogueItemBody }) => api.catalog.update(id, body),
    onSuccess: () => void qc.invalidateQueries({ queryKey: catalogKeys.all }),
  });
}
