/**
 * Waiting writes belong to the person who made them (hooks/device-accounts.ts, hooks/write-owner.ts):
 * on a device where one person edited offline and another then signed in, nothing of the first
 * reaches the server under the second's session, the second sees a line saying changes of another
 * account wait here and none of the first's jobs, and the first person's changes go when they sign
 * in again. Signing out with changes waiting asks first.
 */
import { act, fireEvent, screen, waitFor } from '@testing-library/react';
import { hydrate, onlineManager, type DehydratedState, type QueryClient } from '@tanstack/react-query';
import { SignOutButton } from '@/components/account/sign-out-button';
import { ConnectionStatus, OTHER_ACCOUNT_WAITING } from '@/components/shell/connection-status';
import { api } from '@/hooks/api';
import { ApiError } from '@/shared/api-client';
import { SET_ASIDE_KEY, isOfflineWrite } from '@/hooks/device-accounts';
import { DEVICE_CACHE_KEY } from '@/hooks/offline';
import { usePlacementWrites } from '@/hooks/use-placement-writes';
import { conflictKeys, projectKeys, useProjectQuery, type StoredConflict } from '@/hooks/use-projects';
import { useSignInMutation } from '@/hooks/use-session';
import type { PlacementDto, ProjectDto, UserDto } from '@/shared/schemas';
import { testPlacement, testUser } from './fixtures';
import { startOnDevice } from './render';

jest.mock('@/hooks/api', () => ({
  api: {
    auth: { signOut: jest.fn(), session: jest.fn(), signIn: jest.fn() },
    projects: { get: jest.fn(), update: jest.fn(), updatePlacement: jest.fn(), removePlacement: jest.fn(), addPlacement: jest.fn() },
  },
}));

const ines = testUser({ id: 11, email: 'ines@fitters-demo.example', role: 'installer' });
const rafael = testUser({ id: 12, email: 'rafael@fitters-demo.example', name: 'Rafael (demo)', role: 'reviewer' });
const placement: PlacementDto = testPlacement({ viewerId: null });
const project = {
  id: 3,
  version: 1,
  name: 'Dock',
  scene: { walls: [], zones: [], viewers: [] },
  placements: [placement],
} as unknown as ProjectDto;

/** Who the server says is signed in with the browser's cookie. */
const serverSays = (user: UserDto | null) => jest.mocked(api.auth.session).mockResolvedValue({ user });

const appStart = startOnDevice;

/** The shell's line, a mirror edit, and signing in and out: what a shared phone shows. */
function Phone() {
  const q = useProjectQuery(3);
  const writes = usePlacementWrites(q.data ?? project);
  const signIn = useSignInMutation();
  return (
    <>
      <ConnectionStatus shape="band" />
      <button data-testid="raise" onClick={() => writes.change(7, { heightM: 3.2 })} />
      <button data-testid="sign-in" onClick={() => signIn.mutate({ email: 'x@y.test', password: 'p' })} />
      <SignOutButton />
    </>
  );
}

const setAside = () => window.localStorage.getItem(SET_ASIDE_KEY) ?? '';
const waitingInCache = (client: QueryClient) =>
  client
    .getMutationCache()
    .getAll()
    .filter((m) => isOfflineWrite(m) && m.state.status === 'pending');
const othersLine = () => screen.queryByTestId('connection-status-others')?.textContent ?? '';

/** Ines opens the job, goes offline and raises the mirror: one change waits, made by her. */
async function inesEditsOffline(): Promise<QueryClient & { unmountApp: () => void }> {
  serverSays(ines);
  jest.mocked(api.projects.get).mockResolvedValue({ project });
  const { client, unmount } = appStart(<Phone />, ines);
  await waitFor(() => expect(client.getQueryData(projectKeys.detail(3))).toBeDefined());
  act(() => onlineManager.setOnline(false));
  act(() => screen.getByTestId('raise').click());
  await screen.findByText('Offline · 1 change waits to be sent');
  return Object.assign(client, { unmountApp: unmount });
}

beforeEach(() => {
  jest.clearAllMocks();
  window.localStorage.clear();
  act(() => onlineManager.setOnline(true));
  jest.mocked(api.projects.updatePlacement).mockResolvedValue({ placement: { ...placement, heightM: 3.2, version: 5 }, projectVersion: 2 });
});
afterAll(() => onlineManager.setOnline(true));

describe('a change waiting on a device where someone else signs in', () => {
  it('records who made it, and the record is kept on the device with the change', async () => {
    const client = await inesEditsOffline();
    expect(waitingInCache(client).map((m) => m.state.context)).toEqual([{ ownerId: ines.id }]);
    await waitFor(() => expect(window.localStorage.getItem(DEVICE_CACHE_KEY)).toContain('"context":{"ownerId":11}'));
  });

  it('is sent when the connection returns and the server says its maker is still the one signed in', async () => {
    await inesEditsOffline();
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledWith(3, 7, { heightM: 3.2, version: placement.version }));
    expect(api.auth.session).toHaveBeenCalled();
  });

  it('asks again shortly when the first question after the reconnection fails, and then sends it', async () => {
    await inesEditsOffline();
    jest.mocked(api.auth.session).mockRejectedValue(new ApiError(0, 'Sightfan cannot reach its server.'));
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(api.auth.session).toHaveBeenCalled());
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();
    serverSays(ines);
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1), { timeout: 3000 });
  });

  it('is not sent when the connection returns under another person’s session, and that person sees the line and none of the job', async () => {
    const client = await inesEditsOffline();
    // Another tab on the device signed Rafael in meanwhile: the cookie is now his.
    serverSays(rafael);
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(othersLine()).toBe(OTHER_ACCOUNT_WAITING));
    expect(client.getQueryData(['session', 'me'])).toEqual(rafael);
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();
    expect(waitingInCache(client)).toEqual([]);
    expect(client.getQueryData(projectKeys.detail(3))).toBeUndefined();
    expect(setAside()).toContain('"ownerId":11');
    // The kept copy of the cache holds nothing of Ines's job any more.
    await waitFor(() => expect(window.localStorage.getItem(DEVICE_CACHE_KEY) ?? '').not.toContain('"Dock"'));
  });

  it('is not sent when the server says nobody is signed in any more, and goes once its owner signs in again, on the version it was made on', async () => {
    const client = await inesEditsOffline();
    serverSays(null);
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(client.getQueryData(['session', 'me'])).toBeNull());
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();
    expect(setAside()).toContain('"ownerId":11');

    serverSays(ines);
    jest.mocked(api.auth.signIn).mockResolvedValue({ user: ines });
    act(() => screen.getByTestId('sign-in').click());
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1));
    expect(api.projects.updatePlacement).toHaveBeenCalledWith(3, 7, { heightM: 3.2, version: placement.version });
    expect(setAside()).toBe('');
  });

  it('stays set aside through a reload while the other person is signed in, and goes when its owner signs in after them', async () => {
    const first = await inesEditsOffline();
    serverSays(rafael);
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(othersLine()).toBe(OTHER_ACCOUNT_WAITING));
    await waitFor(() => expect(window.localStorage.getItem(DEVICE_CACHE_KEY) ?? '').not.toContain('"mutations":[{'));
    act(() => first.unmountApp());
    first.clear();

    // The page is loaded again with Rafael signed in: still nothing of Ines's is sent.
    const second = appStart(<Phone />, rafael);
    await waitFor(() => expect(othersLine()).toBe(OTHER_ACCOUNT_WAITING));
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();

    // Rafael signs out (nothing of his waits, so nothing is asked); Ines signs in.
    jest.mocked(api.auth.signOut).mockResolvedValue(undefined as never);
    fireEvent.click(screen.getByTestId('account-sign-out'));
    await waitFor(() => expect(second.client.getQueryData(['session', 'me'])).toBeNull());
    expect(screen.queryByTestId('sign-out-confirmation')).toBeNull();
    serverSays(ines);
    jest.mocked(api.auth.signIn).mockResolvedValue({ user: ines });
    act(() => screen.getByTestId('sign-in').click());
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledWith(3, 7, { heightM: 3.2, version: placement.version }));
    await waitFor(() => expect(othersLine()).toBe(''));
  });

  it('is sent once though a kept cache saved a moment too early brings it back beside its set-aside copy', async () => {
    const client = await inesEditsOffline();
    serverSays(rafael);
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(othersLine()).toBe(OTHER_ACCOUNT_WAITING));
    // The page was reloaded before the kept cache was saved without it: the write is back in the cache.
    const copy = (JSON.parse(setAside()) as Record<string, { writes: DehydratedState['mutations'] }>)['11'].writes;
    act(() => hydrate(client, { mutations: copy, queries: [] }));
    await act(() => client.resumePausedMutations());
    expect((JSON.parse(setAside()) as Record<string, { writes: unknown[] }>)['11'].writes).toHaveLength(1);

    serverSays(ines);
    jest.mocked(api.auth.signIn).mockResolvedValue({ user: ines });
    act(() => screen.getByTestId('sign-in').click());
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalled());
    await waitFor(() => expect(waitingInCache(client)).toEqual([]));
    expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1);
  });

  it('is kept for its owner, not lost, when the server refuses it because the session ended just before it was sent', async () => {
    const client = await inesEditsOffline();
    jest.mocked(api.projects.updatePlacement).mockRejectedValueOnce(new ApiError(401, 'Sign in to continue.'));
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(client.getQueryData(['session', 'me'])).toBeNull());
    expect(waitingInCache(client)).toEqual([]);
    expect(setAside()).toContain('"ownerId":11');

    serverSays(ines);
    jest.mocked(api.auth.signIn).mockResolvedValue({ user: ines });
    act(() => screen.getByTestId('sign-in').click());
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledTimes(2));
    expect(jest.mocked(api.projects.updatePlacement).mock.calls[1]).toEqual([3, 7, { heightM: 3.2, version: placement.version }]);
    await waitFor(() => expect(setAside()).toBe(''));
  });
});

describe('a refused change waiting for its maker’s choice', () => {
  it('is set aside when they sign out, unseen by the next person, and back when they sign in again', async () => {
    serverSays(ines);
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const { client } = appStart(<Phone />, ines);
    await waitFor(() => expect(client.getQueryData(projectKeys.detail(3))).toBeDefined());
    const conflict: StoredConflict = { placementId: 7, message: 'Changed meanwhile.', mine: { heightM: 3.2 }, theirs: placement };
    act(() => client.setQueryData(conflictKeys.project(3), [conflict]));

    jest.mocked(api.auth.signOut).mockResolvedValue(undefined as never);
    fireEvent.click(screen.getByTestId('account-sign-out'));
    await waitFor(() => expect(client.getQueryData(['session', 'me'])).toBeNull());
    expect(client.getQueryData(conflictKeys.project(3))).toBeUndefined();
    expect(setAside()).toContain('Changed meanwhile.');

    serverSays(rafael);
    jest.mocked(api.auth.signIn).mockResolvedValue({ user: rafael });
    act(() => screen.getByTestId('sign-in').click());
    await waitFor(() => expect(client.getQueryData(['session', 'me'])).toEqual(rafael));
    expect(client.getQueryData(conflictKeys.project(3))).toBeUndefined();

    jest.mocked(api.auth.signOut).mockResolvedValue(undefined as never);
    fireEvent.click(screen.getByTestId('account-sign-out'));
    await waitFor(() => expect(client.getQueryData(['session', 'me'])).toBeNull());
    serverSays(ines);
    jest.mocked(api.auth.signIn).mockResolvedValue({ user: ines });
    act(() => screen.getByTestId('sign-in').click());
    await waitFor(() => expect(client.getQueryData(conflictKeys.project(3))).toEqual([conflict]));
    expect(client.getQueryData<ProjectDto>(projectKeys.detail(3))?.version).toBe(project.version);
  });
});

describe('a session that changed under the app', () => {
  it('drops the first person’s kept jobs as soon as the server names someone else, with nothing waiting', async () => {
    serverSays(ines);
    jest.mocked(api.projects.get).mockResolvedValue({ project });
    const { client } = appStart(<Phone />, ines);
    await waitFor(() => expect(client.getQueryData(projectKeys.detail(3))).toBeDefined());
    serverSays(rafael);
    await act(() => client.refetchQueries({ queryKey: ['session', 'me'] }));
    await waitFor(() => expect(client.getQueryData(projectKeys.detail(3))).toBeUndefined());
    expect(client.getQueryData(['session', 'me'])).toEqual(rafael);
    await waitFor(() => expect(window.localStorage.getItem(DEVICE_CACHE_KEY) ?? '').not.toContain('"Dock"'));
  });
});

describe('signing out with one’s own changes waiting', () => {
  it('asks first, with the count, and "Stay signed in" signs nobody out', async () => {
    await inesEditsOffline();
    fireEvent.click(screen.getByTestId('account-sign-out'));
    expect(screen.getByTestId('sign-out-question').textContent).toBe(
      '1 change you made has not reached the server yet. Keep it on this device for the next time you sign in here, or discard it?',
    );
    fireEvent.click(screen.getByTestId('sign-out-stay'));
    expect(screen.queryByTestId('sign-out-confirmation')).toBeNull();
    expect(api.auth.signOut).not.toHaveBeenCalled();
  });

  it('"Keep it for next time" sets the change aside for this person only, out of the cache the next person gets', async () => {
    const client = await inesEditsOffline();
    jest.mocked(api.auth.signOut).mockResolvedValue(undefined as never);
    fireEvent.click(screen.getByTestId('account-sign-out'));
    fireEvent.click(screen.getByTestId('sign-out-keep'));
    // Set aside at once: the sign-out waits for the connection, the change must not go before it.
    expect(waitingInCache(client)).toEqual([]);
    expect(setAside()).toContain('"ownerId":11');
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(client.getQueryData(['session', 'me'])).toBeNull());
    expect(api.auth.signOut).toHaveBeenCalledTimes(1);
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();
    expect(client.getQueryData(projectKeys.detail(3))).toBeUndefined();
    expect(setAside()).toContain('"ownerId":11');
  });

  it('"Discard it" drops the change and keeps nothing of it on the device', async () => {
    const client = await inesEditsOffline();
    jest.mocked(api.auth.signOut).mockResolvedValue(undefined as never);
    fireEvent.click(screen.getByTestId('account-sign-out'));
    fireEvent.click(screen.getByTestId('sign-out-discard'));
    act(() => onlineManager.setOnline(true));
    await waitFor(() => expect(client.getQueryData(['session', 'me'])).toBeNull());
    expect(waitingInCache(client)).toEqual([]);
    expect(setAside()).toBe('');
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();
  });
});
