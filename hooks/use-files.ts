/**
 * A job's uploaded files (plan underlays and photos): the list, deleting one, and the addresses of a
 * file and its thumbnail. Uploading itself goes through XMLHttpRequest for its progress
 * (components/uploads/upload-request.ts); these reads and deletes use fetch like the API client.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ApiError } from '@/shared/api-client';
import type { ApiErrorBody } from '@/shared/schemas';
import type { FileDto } from '@/shared/schemas/files';

/** '' for the same origin; EXPO_PUBLIC_API_URL points a dev bundle at the API on another port (as hooks/api.ts). */
export const API_BASE = (process.env.EXPO_PUBLIC_API_URL ?? '').replace(/\/$/, '');

export const fileKeys = {
  all: ['files'] as const,
  project: (projectId: number) => [...fileKeys.all, 'project', projectId] as const,
};

/** An address the API gave (`/api/files/…`), made absolute for a dev bundle served from another port. */
export function apiAddress(path: string): string {
  return /^https?:\/\//.test(path) ? path : `${API_BASE}${path}`;
}

/** Where the upload goes. */
export const uploadAddress = (projectId: number) => `${API_BASE}/api/projects/${projectId}/files`;
/** The stored file (plan raster or photo), served only through the job's access rules. */
export const fileAddress = (file: Pick<FileDto, 'id' | 'url'>) => apiAddress(file.url || `/api/files/${encodeURIComponent(file.id)}`);
export const thumbnailAddress = (file: Pick<FileDto, 'id' | 'thumbnailUrl'>) =>
  apiAddress(file.thumbnailUrl || `/api/files/${encodeURIComponent(file.id)}/thumbnail`);

async function call<T>(method: string, path: string): Promise<T> {
  let res: Response;
  try {
    res = await fetch(`${API_BASE}/api${path}`, { method, credentials: 'include', headers: { Accept: 'application/json' } });
  } catch {
    throw new ApiError(0, 'Sightfan cannot reach its server. Check the connection and try again.');
  }
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let data: unknown;
  try {
    data = text ? JSON.parse(text) : undefined;
  } catch {
    data = undefined;
  }
  if (!res.ok) {
    const body = (data ?? {}) as Partial<ApiErrorBody>;
    throw new ApiError(
      res.status,
      typeof body.error === 'string' ? body.error : `The server answered ${res.status} without an explanation. Try again in a moment.`,
      body.fields ?? {},
    );
  }
  return data as T;
}

export const filesApi = {
  list: (projectId: number) => call<{ files: FileDto[] }>('GET', `/projects/${projectId}/files`),
  remove: (fileId: string) => call<void>('DELETE', `/files/${encodeURIComponent(fileId)}`),
};

export function useProjectFilesQuery(projectId: number) {
  return useQuery({
    queryKey: fileKeys.project(projectId),
    queryFn: async () => (await filesApi.list(projectId)).files,
    staleTime: 30_000,
  });
}

/** The cached list with a new file in it (an upload answered 201). */
export function useAddFileToCache(projectId: number) {
  const qc = useQueryClient();
  return (file: FileDto) => {
    qc.setQueryData<FileDto[]>(fileKeys.project(projectId), (old) => (old ? [...old.filter((f) => f.id !== file.id), file] : [file]));
    void qc.invalidateQueries({ queryKey: fileKeys.project(projectId) });
  };
}

export function useDeleteFileMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (fileId: string) => {
      try {
        await filesApi.remove(fileId);
      } catch (e) {
        // Already gone is what was wanted.
        if (!(e instanceof ApiError && e.status === 404)) throw e;
      }
      return fileId;
    },
    onSuccess: (fileId) => {
      qc.setQueryData<FileDto[]>(fileKeys.project(projectId), (old) => old?.filter((f) => f.id !== fileId));
      void qc.invalidateQueries({ queryKey: fileKeys.project(projectId) });
    },
  });
}
