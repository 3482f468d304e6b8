import { act, renderHook, waitFor } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { api } from '@/hooks/api';
import { projectKeys } from '@/hooks/use-projects';
import { useTransitionMutation } from '@/hooks/use-review';
import { ApiError } from '@/shared/api-client';
import type { ProjectDto } from '@/shared/schemas';
import { makeTestQueryClient } from './render';

jest.mock('@/hooks/api', () => ({
  api: {
    projects: { approve: jest.fn(), send: jest.fn(), return: jest.fn(), get: jest.fn(), list: jest.fn(), events: jest.fn() },
    comments: { list: jest.fn() },
    sheets: { status: jest.fn() },
  },
}));

/** Only the fields the transition reads; the rest of a project does not matter here. */
const loaded = { id: 3, version: 7, state: 'with_reviewer' } as unknown as ProjectDto;

function setup() {
  const client = makeTestQueryClient();
  client.setQueryData(projectKeys.detail(3), loaded);
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return { client, ...renderHook(() => useTransitionMutation(3), { wrapper }) };
}

beforeEach(() => jest.resetAllMocks());

describe('review transitions', () => {
  it('approve sends the version of the job the reviewer has loaded, and the answer replaces it', async () => {
    const approved = { ...loaded, version: 8, state: 'approved' } as ProjectDto;
    jest.mocked(api.projects.approve).mockResolvedValue({ project: approved });
    const { client, result } = setup();
    await act(() => result.current.mutateAsync({ action: 'approve' }));
    expect(api.projects.approve).toHaveBeenCalledWith(3, { version: 7 });
    expect(client.getQueryData(projectKeys.detail(3))).toEqual(approved);
  });

  it('a stale approve (409) puts the job as it now stands on the screen, still not approved', async () => {
    const changed = { ...loaded, version: 9, state: 'with_reviewer' } as ProjectDto;
    jest.mocked(api.projects.approve).mockRejectedValue(new ApiError(409, 'Someone changed this job.', {}, undefined, changed));
    const { client, result } = setup();
    act(() => result.current.mutate({ action: 'approve' }));
    await waitFor(() => expect(result.current.isError).toBe(true));
    expect(client.getQueryData<ProjectDto>(projectKeys.detail(3))?.version).toBe(9);
  });

  it('return sends the reason with the version, and send names the chosen reviewer', async () => {
    jest.mocked(api.projects.return).mockResolvedValue({ project: loaded });
    jest.mocked(api.projects.send).mockResolvedValue({ project: loaded });
    const { result } = setup();
    await act(() => result.current.mutateAsync({ action: 'return', reason: 'Aim M2 lower.' }));
    expect(api.projects.return).toHaveBeenCalledWith(3, { version: 7, reason: 'Aim M2 lower.' });
    await act(() => result.current.mutateAsync({ action: 'send', reviewerId: 12 }));
    expect(api.projects.send).toHaveBeenCalledWith(3, { version: 7, reviewerId: 12 });
  });
});
