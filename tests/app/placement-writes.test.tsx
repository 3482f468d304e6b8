import { act, renderHook, waitFor } from '@testing-library/react';
import { QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { api } from '@/hooks/api';
import { usePlacementWrites } from '@/hooks/use-placement-writes';
import { projectKeys, useProjectQuery, useUpdateProjectMutation } from '@/hooks/use-projects';
import { ApiError } from '@/shared/api-client';
import type { PlacementDto, ProjectDto } from '@/shared/schemas';
import { testPlacement } from './fixtures';
import { makeTestQueryClient } from './render';

jest.mock('@/hooks/api', () => ({
  api: { projects: { get: jest.fn(), update: jest.fn(), updatePlacement: jest.fn(), removePlacement: jest.fn(), addPlacement: jest.fn() } },
}));

const placement: PlacementDto = testPlacement({ viewerId: null });
const project = { id: 3, version: 1, scene: { walls: [], zones: [], viewers: [] }, placements: [placement] } as unknown as ProjectDto;

function setup() {
  const client = makeTestQueryClient();
  client.setQueryData(projectKeys.detail(3), project);
  jest.mocked(api.projects.get).mockResolvedValue({ project });
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return renderHook(
    () => {
      const q = useProjectQuery(3);
      return usePlacementWrites(q.data ?? project);
    },
    { wrapper },
  );
}

beforeEach(() => jest.clearAllMocks());

describe('usePlacementWrites', () => {
  it('sends a second save only after the first, with the version the first produced', async () => {
    let finishFirst: (v: { placement: PlacementDto; projectVersion: number }) => void = () => undefined;
    jest
      .mocked(api.projects.updatePlacement)
      .mockImplementationOnce(() => new Promise((resolve) => (finishFirst = resolve)))
      .mockResolvedValueOnce({ placement: { ...placement, heightM: 3, tiltDownRad: 0.2, version: 6 }, projectVersion: 9 });
    const { result } = setup();

    act(() => result.current.change(7, { heightM: 3 }));
    act(() => result.current.change(7, { tiltDownRad: 0.2 }));
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1));
    expect(api.projects.updatePlacement).toHaveBeenLastCalledWith(3, 7, { heightM: 3, version: 4 });

    await act(async () => finishFirst({ placement: { ...placement, heightM: 3, version: 5 }, projectVersion: 9 }));
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledTimes(2));
    expect(api.projects.updatePlacement).toHaveBeenLastCalledWith(3, 7, { heightM: 3, tiltDownRad: 0.2, version: 5 });
    await waitFor(() => expect(result.current.unsaved[7]).toBeUndefined());
    // Both answers count: the first save's end is not lost behind the second (it once stayed "Saving…").
    await waitFor(() => expect(result.current.saving).toBe(false));
  });

  it('keeps the unsaved values after a 409, beside the saved ones, and sends nothing more until the person chooses', async () => {
    const theirs = { ...placement, heightM: 2.4, version: 5 };
    jest
      .mocked(api.projects.updatePlacement)
      .mockRejectedValue(new ApiError(409, 'Someone else changed this mirror.', {}, undefined, theirs));
    const { result } = setup();

    act(() => result.current.change(7, { heightM: 3 }));
    await waitFor(() => expect(result.current.conflicts[7]).toBeDefined());
    act(() => result.current.change(7, { notes: 'later' }));

    expect(result.current.conflicts[7]).toMatchObject({ mine: { heightM: 3, notes: 'later' }, theirs: { heightM: 2.4 } });
    expect(result.current.placements[0]).toMatchObject({ heightM: 3, notes: 'later', version: 5 });
    expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1);

    // The stored copy of the conflict is forgotten too; its cache notice arrives on the next tick.
    await act(async () => {
      result.current.useTheirs(7);
      await new Promise((r) => setTimeout(r, 0));
    });
    expect(result.current.placements[0]).toMatchObject({ heightM: 2.4, notes: '' });
    expect(result.current.conflicts[7]).toBeUndefined();
  });

  it("runs a plan save after a mirror save queued before it, with the project's version that mirror save answered", async () => {
    let finishMirror: (v: { placement: PlacementDto; projectVersion: number }) => void = () => undefined;
    jest.mocked(api.projects.updatePlacement).mockImplementationOnce(() => new Promise((resolve) => (finishMirror = resolve)));
    jest.mocked(api.projects.update).mockResolvedValue({ project: { ...project, version: 3 } });
    const client = makeTestQueryClient();
    client.setQueryData(projectKeys.detail(3), project);
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={client}>{children}</QueryClientProvider>;
    const { result } = renderHook(
      () => {
        const q = useProjectQuery(3);
        return { writes: usePlacementWrites(q.data ?? project), plan: useUpdateProjectMutation(3) };
      },
      { wrapper },
    );

    act(() => result.current.writes.change(7, { heightM: 3 }));
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1));
    // The plan save shows its change in the cache at once (an update that arrives on the next tick).
    await act(async () => {
      result.current.plan.mutate({ projectId: 3, body: { notes: 'After the mirror' } });
      await new Promise((r) => setTimeout(r, 50));
    });
    expect(api.projects.update).not.toHaveBeenCalled();

    await act(async () => finishMirror({ placement: { ...placement, heightM: 3, version: 5 }, projectVersion: 2 }));
    await waitFor(() => expect(api.projects.update).toHaveBeenCalledWith(3, { notes: 'After the mirror', version: 2 }));
  });
});
