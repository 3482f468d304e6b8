import '@testing-library/jest-dom';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { UsersPanel } from '@/components/users/users-panel';
import { api } from '@/hooks/api';
import { useIsWide } from '@/hooks/use-breakpoint';
import { userKeys } from '@/hooks/use-users';
import type { UserDto } from '@/shared/schemas';
import { testUser } from './fixtures';
import { makeTestQueryClient, renderWithQuery } from './render';

jest.mock('@/hooks/use-breakpoint', () => ({ useIsWide: jest.fn() }));
jest.mock('@/hooks/api', () => ({ api: { users: { list: jest.fn(), update: jest.fn(), invite: jest.fn() } } }));

function person(id: number, overrides: Partial<UserDto> = {}): UserDto {
  return testUser({
    id,
    email: `person${id}@sightfan-demo.example`,
    name: `Person ${id}`,
    organizationName: 'Demo Yard Ltd (demo)',
    ...overrides,
  });
}

const people = [
  person(1, { role: 'admin', name: 'Ada Admin' }),
  person(2, { name: 'Ines Installer' }),
  person(3, { role: 'reviewer', hasPassword: false }),
];

/** A client already holding the list, so the panel renders without asking the (mocked) API. */
function clientWithPeople() {
  const client = makeTestQueryClient();
  client.setQueryData(userKeys.list(), people);
  return client;
}

describe('UsersPanel', () => {
  it('renders people as a table on a wide screen', () => {
    jest.mocked(useIsWide).mockReturnValue(true);
    renderWithQuery(<UsersPanel currentUserId={1} />, clientWithPeople());

    const table = screen.getByTestId('users-table');
    expect(table).toHaveAttribute('role', 'table');
    expect(within(table).getAllByRole('row')).toHaveLength(1 + people.length);
    expect(screen.queryByTestId('users-list')).not.toBeInTheDocument();
  });

  it('renders people as a list on a phone', () => {
    jest.mocked(useIsWide).mockReturnValue(false);
    renderWithQuery(<UsersPanel currentUserId={1} />, clientWithPeople());

    expect(within(screen.getByTestId('users-list')).getAllByRole('listitem')).toHaveLength(people.length);
    expect(screen.queryByTestId('users-table')).not.toBeInTheDocument();
  });

  it('marks someone who has not chosen a password yet as invited', () => {
    jest.mocked(useIsWide).mockReturnValue(false);
    renderWithQuery(<UsersPanel currentUserId={1} />, clientWithPeople());

    expect(screen.getByTestId('user-status-3')).toHaveTextContent(/invited/i);
    expect(screen.getByTestId('user-status-2')).toHaveTextContent(/active/i);
  });

  it('disables the person whose Disable button is pressed', async () => {
    jest.mocked(useIsWide).mockReturnValue(true);
    const disabled = { ...people[1], disabled: true };
    jest.mocked(api.users.update).mockResolvedValue({ user: disabled });
    jest.mocked(api.users.list).mockResolvedValue({ users: [people[0], disabled, people[2]] });
    renderWithQuery(<UsersPanel currentUserId={1} />, clientWithPeople());

    fireEvent.click(screen.getByTestId('user-disable-2'));

    await waitFor(() => expect(api.users.update).toHaveBeenCalledWith(2, { disabled: true }));
    expect(await screen.findByTestId('user-status-2')).toHaveTextContent(/disabled/i);
  });

  it('changes a role from the row', async () => {
    jest.mocked(useIsWide).mockReturnValue(true);
    const promoted = { ...people[1], role: 'reviewer' as const };
    jest.mocked(api.users.update).mockResolvedValue({ user: promoted });
    jest.mocked(api.users.list).mockResolvedValue({ users: [people[0], promoted, people[2]] });
    renderWithQuery(<UsersPanel currentUserId={1} />, clientWithPeople());

    fireEvent.click(screen.getByTestId('user-role-2-reviewer'));

    await waitFor(() => expect(api.users.update).toHaveBeenCalledWith(2, { role: 'reviewer' }));
    await waitFor(() => expect(screen.getByTestId('user-role-2-reviewer')).toHaveAttribute('aria-checked', 'true'));
  });

  it('does not let the signed-in admin disable themselves', () => {
    jest.mocked(useIsWide).mockReturnValue(true);
    renderWithQuery(<UsersPanel currentUserId={1} />, clientWithPeople());

    expect(screen.queryByTestId('user-disable-1')).not.toBeInTheDocument();
    expect(screen.getByTestId('user-role-1-installer')).toHaveAttribute('aria-disabled', 'true');
  });
});
