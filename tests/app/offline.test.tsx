/**
 * What the device keeps and what waits for a connection (hooks/offline.ts): the kept cache
 * survives a reload (a new client restoring from the same storage), a mirror edit made offline
 * waits, is counted in the shell's connection line, and is sent after a reload when the
 * connection returns; signing out leaves nothing of the person on the device.
 */
import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { onlineManager, QueryClientProvider, useIsRestoring, useQuery } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { ConnectionStatus } from '@/components/shell/connection-status';
import { api } from '@/hooks/api';
import { DEVICE_CACHE_KEY, forgetDeviceData } from '@/hooks/offline';
import { usePlacementWrites } from '@/hooks/use-placement-writes';
import { usePlanEdits } from '@/hooks/use-plan-edits';
import { useProjectQuery } from '@/hooks/use-projects';
import { useQuickSaveMutation, type QuickSaveVars } from '@/hooks/use-quick-save';
import type { PlacementDto, ProjectDto } from '@/shared/schemas';
import { testPlacement, testUser } from './fixtures';
import { makeTestQueryClient, startOnDevice } from './render';

jest.mock('@/hooks/api', () => ({
  api: {
    auth: { signOut: jest.fn(), session: jest.fn() },
    projects: {
      get: jest.fn(),
      create: jest.fn(),
      update: jest.fn(),
      updatePlacement: jest.fn(),
      removePlacement: jest.fn(),
      addPlacement: jest.fn(),
    },
  },
}));

const placement: PlacementDto = testPlacement({ viewerId: null });
const project = {
  id: 3,
  version: 1,
  name: 'Dock',
  scene: { walls: [], zones: [], viewers: [] },
  placements: [placement],
} as unknown as ProjectDto;

/** The person signed in on the device in these tests (the server answers for them: see beforeEach). */
const installer = testUser({ id: 11, role: 'installer' });

/** A fresh app start over the device's storage, the installer's session remembered. */
const appStart = (children: ReactNode) => startOnDevice(children, installer);

function JobName() {
  const q = useProjectQuery(3);
  return <p data-testid="job">{q.data ? q.data.name : q.fetchStatus}</p>;
}

/** Waits until the kept cache in storage satisfies `check` (the persister writes after a short throttle). */
async function kept(check: (raw: string) => boolean) {
  await waitFor(() => expect(check(window.localStorage.getItem(DEVICE_CACHE_KEY) ?? '')).toBe(true), { timeout: 3000 });
}

beforeEach(() => {
  jest.clearAllMocks();
  jest.mocked(api.auth.session).mockResolvedValue({ user: installer });
  window.localStorage.clear();
  act(() => onlineManager.setOnline(true));
});
afterAll(() => onlineManager.setOnline(true));

describe('the cache kept on the device', () => {
  it('shows a job opened before after a reload with no connection, without asking the server', async () => {
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const first = appStart(<JobName />);
    await screen.findByText('Dock');
    await kept((raw) => raw.includes('"detail",3]'));
    first.unmount();
    first.client.clear();

    act(() => onlineManager.setOnline(false));
    jest.mocked(api.projects.get).mockRejectedValue(new Error('no network'));
    appStart(<JobName />);
    await screen.findByText('Dock');
    expect(api.projects.get).toHaveBeenCalledTimes(1);
  });

  it('asks the server again after a reload with a connection, though the kept answer is seconds old', async () => {
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const first = appStart(<JobName />);
    await screen.findByText('Dock');
    await kept((raw) => raw.includes('"detail",3]'));
    first.unmount();
    first.client.clear();

    // Changed on the server meanwhile (sent for review from another device, say).
    jest.mocked(api.projects.get).mockResolvedValue({ project: { ...project, name: 'Dock (changed elsewhere)' } });
    appStart(<JobName />);
    await screen.findByText('Dock (changed elsewhere)');
    expect(api.projects.get).toHaveBeenCalledTimes(2);
  });

  it('keeps nothing that is not data the person works with offline (a sheet status, an invitation)', async () => {
    function Other() {
      useQuery({ queryKey: ['sheet', 3], queryFn: () => ({ ok: true }) });
      useQuery({ queryKey: ['session', 'invitation', 'tok'], queryFn: () => ({ email: 'a@b.test' }) });
      useProjectQuery(3);
      return null;
    }
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    appStart(<Other />);
    await kept((raw) => raw.includes('"detail",3]'));
    const raw = window.localStorage.getItem(DEVICE_CACHE_KEY)!;
    expect(raw).not.toContain('"sheet"');
    expect(raw).not.toContain('invitation');
  });
});

it('never keeps "nobody signed in", so a load right after signing in asks the server instead of showing the sign-in screen', async () => {
  function Session() {
    useQuery({ queryKey: ['session', 'me'], queryFn: () => null });
    useProjectQuery(3);
    return null;
  }
  jest.mocked(api.projects.get).mockResolvedValue({ project });
  appStart(<Session />);
  await kept((raw) => raw.includes('"detail",3]'));
  expect(window.localStorage.getItem(DEVICE_CACHE_KEY)).not.toContain('"me"');
});

describe('a change made offline', () => {
  function Editor() {
    const q = useProjectQuery(3);
    const writes = usePlacementWrites(q.data ?? project);
    return (
      <>
        <ConnectionStatus shape="band" />
        <button data-testid="raise" onClick={() => writes.change(7, { heightM: 3.2 })} />
        <p data-testid="height">{String(writes.placements[0].heightM)}</p>
      </>
    );
  }

  it('waits, is counted in the connection line, and is sent with the version kept on the device when the connection returns after a reload', async () => {
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const first = appStart(<Editor />);
    await kept((raw) => raw.includes('"detail",3]'));

    act(() => onlineManager.setOnline(false));
    act(() => screen.getByTestId('raise').click());
    expect((await screen.findByTestId('connection-status-text')).textContent).toBe('Offline · 1 change waits to be sent');
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();
    await kept((raw) => raw.includes('"mutations":[{'));
    first.unmount();
    first.client.clear();

    // The page is loaded again, still offline: the waiting change and the shown height came back.
    jest.mocked(api.projects.get).mockRejectedValue(new Error('no network'));
    appStart(<Editor />);
    await waitFor(() => expect(screen.getByTestId('connection-status-text').textContent).toBe('Offline · 1 change waits to be sent'));
    expect(screen.getByTestId('height').textContent).toBe('3.2');

    jest
      .mocked(api.projects.updatePlacement)
      .mockResolvedValue({ placement: { ...placement, heightM: 3.2, version: 5 }, projectVersion: 2 });
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1));
    expect(api.projects.updatePlacement).toHaveBeenCalledWith(3, 7, { heightM: 3.2, version: placement.version });
    await waitFor(() => expect(screen.queryByTestId('connection-status-text')).toBeNull());
  });

  it('keeps every plan edit made offline through a reload, and sends them in order, each with the version the one before returned', async () => {
    const withViewer = (id: string) => ({ id, name: id, positionM: [1, 1] as [number, number], eyeHeightM: 1.6 });
    const sceneA = { walls: [], zones: [], viewers: [withViewer('a')] };
    const sceneB = { walls: [], zones: [], viewers: [withViewer('a'), withViewer('b')] };
    function Plan() {
      const q = useProjectQuery(3);
      const edits = usePlanEdits(q.data ?? project);
      return (
        <>
          <ConnectionStatus shape="band" />
          <button data-testid="edit-a" onClick={() => void edits.saveScene(sceneA)} />
          <button data-testid="edit-b" onClick={() => void edits.saveScene(sceneB)} />
        </>
      );
    }
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const first = appStart(<Plan />);
    await kept((raw) => raw.includes('"detail",3]'));

    act(() => onlineManager.setOnline(false));
    act(() => screen.getByTestId('edit-a').click());
    act(() => screen.getByTestId('edit-b').click());
    expect((await screen.findByTestId('connection-status-text')).textContent).toBe('Offline · 2 changes wait to be sent');
    await kept((raw) => (raw.match(/"mutationKey":\["projects","update"\]/g) ?? []).length === 2);
    first.unmount();
    first.client.clear();

    jest.mocked(api.projects.get).mockRejectedValue(new Error('no network'));
    appStart(<Plan />);
    await waitFor(() => expect(screen.getByTestId('connection-status-text').textContent).toBe('Offline · 2 changes wait to be sent'));

    jest
      .mocked(api.projects.update)
      .mockImplementation(async (_id, body) => ({ project: { ...project, scene: body.scene!, version: body.version + 1 } as ProjectDto }));
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(api.projects.update).toHaveBeenCalledTimes(2));
    expect(jest.mocked(api.projects.update).mock.calls.map(([, body]) => [body.scene?.viewers?.length, body.version])).toEqual([
      [1, 1],
      [2, 2],
    ]);
  });

  it('is dropped from the device with everything else kept when the person signs out', async () => {
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const { client } = appStart(<Editor />);
    await kept((raw) => raw.includes('"detail",3]'));
    act(() => onlineManager.setOnline(false));
    act(() => screen.getByTestId('raise').click());
    await screen.findByTestId('connection-status-text');

    await act(() => forgetDeviceData(client));
    expect(window.localStorage.getItem(DEVICE_CACHE_KEY)).toBeNull();
    expect(
      client
        .getMutationCache()
        .getAll()
        .filter((m) => m.state.status === 'pending'),
    ).toEqual([]);
    await waitFor(() =>
      expect(screen.queryByTestId('connection-status-text')?.textContent ?? '').toBe('Offline · showing what this device keeps'),
    );
  });
});

describe('"Save as a job" with no signal', () => {
  const vars = {
    project: {
      name: 'Blind corner (test)',
      kind: 'site',
      notes: 'Started from quick sizing.',
      scene: { walls: [], zones: [], viewers: [] },
    },
    placement: { label: 'M1', catalogueItemId: 1, positionM: [1, 2], heightM: 3, azimuthRad: 0, tiltDownRad: 0.2, viewerId: null },
  } as unknown as QuickSaveVars;

  function SaveButton() {
    const save = useQuickSaveMutation();
    // The kept cache is written from the moment it has been restored.
    return useIsRestoring() ? null : <button data-testid="save" onClick={() => save.mutate(vars)} />;
  }

  it('waits on the device and, after a reload, creates the job with its mirror once the connection returns', async () => {
    const first = appStart(<SaveButton />);
    act(() => onlineManager.setOnline(false));
    fireEvent.click(await screen.findByTestId('save'));
    await kept((raw) => raw.includes('"quick","save"'));
    expect(api.projects.create).not.toHaveBeenCalled();
    first.unmount();
    first.client.clear();

    jest.mocked(api.projects.create).mockResolvedValue({ project: { ...project, id: 41 } });
    jest.mocked(api.projects.addPlacement).mockResolvedValue({ placement, projectVersion: 2 });
    appStart(<SaveButton />);
    await act(async () => onlineManager.setOnline(true));
    await waitFor(() => expect(api.projects.addPlacement).toHaveBeenCalledWith(41, vars.placement));
    expect(api.projects.create).toHaveBeenCalledWith(vars.project);
    expect(api.projects.create).toHaveBeenCalledTimes(1);
  });
});

describe('the connection line', () => {
  it('says nothing while online with nothing waiting, and is still a polite status region for screen readers', () => {
    const { container } = render(
      <QueryClientProvider client={makeTestQueryClient()}>
        <ConnectionStatus shape="rail" />
      </QueryClientProvider>,
    );
    const region = container.querySelector('[role="status"]')!;
    expect(region.getAttribute('aria-live')).toBe('polite');
    expect(region.textContent).toBe('');
  });
});
