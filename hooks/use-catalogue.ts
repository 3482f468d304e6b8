/** The mirror catalogue: everyone reads it, the admin edits it. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateCatalogueItemBody, PatchCatalogueItemBody } from '@/shared/schemas';
import { api } from './api';

/** The catalogue changes rarely; five minutes keeps pickers quick on a poor connection. */
export const CATALOGUE_STALE_MS = 5 * 60_000;

export const catalogueKeys = {
  all: ['catalogue'] as const,
  list: () => [...catalogueKeys.all, 'list'] as const,
};

export function useCatalogueQuery() {
  return useQuery({
    queryKey: catalogueKeys.list(),
    queryFn: async () => (await api.catalogue.list()).items,
    staleTime: CATALOGUE_STALE_MS,
  });
}

export function useCreateCatalogueItemMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateCatalogueItemBody) => api.catalogue.create(body),
    onSuccess: () => void qc.invalidateQueries({ queryKey: catalogueKeys.all }),
  });
}

export function useUpdateCatalogueItemMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: PatchCatalogueItemBody }) => api.catalogue.update(id, body),
    onSuccess: () => void qc.invalidateQueries({ queryKey: catalogueKeys.all }),
  });
}
