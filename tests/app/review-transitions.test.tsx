import { act, renderHook, waitFor } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { api } from '@/hooks/api';
import { projectKeys } from '@/hooks/use-projects';
import { useTransitionMutation } from '@/hooks/use-review';
import { useReviewPlan } from '@/components/review/use-review-plan';
import { ApiError } from '@/shared/api-client';
import type { ProjectDto } from '@/shared/schemas';
import { makeTestQueryClient } from './render';

jest.mock('@/hooks/api', () => ({
  api: {
    projects: { approve: jest.fn(), send: jest.fn(), return: jest.fn(), get: jest.fn(), list: jest.fn(), events: jest.fn() },
    comments: { list: jest.fn() },
    auth: { me: jest.fn() },
    reviewers: { list: jest.fn() },
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

describe('an approved job changed by a mirror write', () => {
  function renderPlan(project: ProjectDto) {
    const client = makeTestQueryClient();
    jest.mocked(api.comments.list).mockResolvedValue({ comments: [] });
    const spy = jest.spyOn(client, 'invalidateQueries');
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
    const hook = renderHook((p: ProjectDto) => useReviewPlan({ project: p, placements: [], selection: null, wide: true }), {
      wrapper,
      initialProps: project,
    });
    return { spy, ...hook };
  }

  it('fetches the job again when its version moves on while it shows Approved, so a withdrawal shows', () => {
    const approved = { ...loaded, state: 'approved' } as ProjectDto;
    const { spy, rerender } = renderPlan(approved);
    expect(spy).not.toHaveBeenCalledWith({ queryKey: projectKeys.detail(3) });
    rerender({ ...approved, version: 8 });
    expect(spy).toHaveBeenCalledWith({ queryKey: projectKeys.detail(3) });
  });

  it('does not fetch the job again for a version change while it is being drawn up', () => {
    const drawing = { ...loaded, state: 'drawing_up' } as ProjectDto;
    const { spy, rerender } = renderPlan(drawing);
    rerender({ ...drawing, version: 8 });
    expect(spy).not.toHaveBeenCalledWith({ queryKey: projectKeys.detail(3) });
  });
});
