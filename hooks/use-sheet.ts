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

/**
 * Issues a revision with the current content (an explicit POST: downloading alone never issues one),
 * then fetches that revision's PDF (cookies included) and hands it to `save`, which turns it into a
 * file for the person.
 */
export function useDownloadSheetMutation(projectId: number, save: (file: { blob: Blob; filename: string }) => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (paper?: SheetPaper) => {
      const issued = await api.sheets.issue(projectId);
      return api.sheets.download(projectId, issued.revision.number, paper);
    },
    onSuccess: (file) => {
      save(file);
      void qc.invalidateQueries({ queryKey: sheetKeys.status(projectId) });
    },
  });
}

/** Issues a revision and gives the address of its PDF, for platforms that open links instead of saving files. */
export function useIssueSheetMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.sheets.issue(projectId),
    onSuccess: () => void qc.invalidateQueries({ queryKey: sheetKeys.status(projectId) }),
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
