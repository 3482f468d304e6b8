/** The project's specification sheet: its revisions, download and e-mail. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { SheetEmailBody, SheetPaper } from '@/shared/schemas';
import { api } from './api';
import { outboxKeys } from './use-outbox';

/** The sheet changes when the project does; a short stale time keeps "changed since" honest. */
export const SHEET_STALE_MS = 5_000;

export const sheetKeys = {
  all: ['sheets'] as const,
  status: (projectId: number) => [...sheetKeys.all, 'status', projectId] as const,
};

export function useSheetStatusQuery(projectId: number) {
  return useQuery({ queryKey: sheetKeys.status(projectId), queryFn: () => api.sheets.status(projectId), staleTime: SHEET_STALE_MS });
}

/** Fetches the PDF (cookies included) and hands it to `save`, which turns it into a file for the person. */
export function useDownloadSheetMutation(projectId: number, save: (file: { blob: Blob; filename: string }) => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (paper?: SheetPaper) => api.sheets.download(projectId, paper),
    onSuccess: (file) => {
      save(file);
      void qc.invalidateQueries({ queryKey: sheetKeys.status(projectId) });
    },
  });
}

export function useEmailSheetMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SheetEmailBody) => api.sheets.email(projectId, body),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: sheetKeys.status(projectId) });
      void qc.invalidateQueries({ queryKey: outboxKeys.all });
    },
  });
}
