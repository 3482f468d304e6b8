import '@testing-library/jest-dom';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { ProjectForm } from '@/components/projects/project-form';
import { ProjectsList } from '@/components/projects/projects-list';
import { lastChangeText, relativeTime } from '@/components/projects/relative-time';
import { api } from '@/hooks/api';
import { ApiError } from '@/shared/api-client';
import type { ProjectSummaryDto } from '@/shared/schemas';
import { testProjectSummary } from './fixtures';
import { renderWithQuery } from './render';

jest.mock('@/hooks/api', () => ({ api: { projects: { list: jest.fn() } } }));
// Only what these components use: router.push for rows, Link for the empty state's text link.
jest.mock('expo-router', () => ({ router: { push: jest.fn() }, Link: ({ children }: { children: React.ReactNode }) => children }));

const summary: ProjectSummaryDto = testProjectSummary({
  id: 12,
  name: 'Dock 3 cross-aisle',
  customer: 'Invented Foods',
  site: 'Hall 2',
  placementCount: 2,
  createdAt: '2025-01-01T00:00:00.000Z',
  updatedAt: new Date(Date.now() - 2 * 3600_000).toISOString(),
});

beforeEach(() => jest.clearAllMocks());

describe('projects list', () => {
  it('shows each project with customer, site, mirror count and last change', async () => {
    jest.mocked(api.projects.list).mockResolvedValue({ projects: [summary] });
    renderWithQuery(<ProjectsList role="installer" />);

    const row = await screen.findByTestId('project-row-12');
    expect(row).toHaveTextContent('Dock 3 cross-aisle');
    expect(row).toHaveTextContent('Invented Foods · Hall 2');
    expect(row).toHaveTextContent('2 mirrors');
    expect(row).toHaveTextContent('2 h ago');
  });

  it('asks the server again when the sort changes', async () => {
    jest.mocked(api.projects.list).mockResolvedValue({ projects: [summary] });
    renderWithQuery(<ProjectsList role="reviewer" />);
    await screen.findByTestId('project-row-12');

    fireEvent.click(screen.getByTestId('projects-sort-customer'));

    await waitFor(() => expect(api.projects.list).toHaveBeenLastCalledWith({ q: undefined, sort: 'customer' }));
  });

  it('shows the honest empty state when there are no projects at all', async () => {
    jest.mocked(api.projects.list).mockResolvedValue({ projects: [] });
    renderWithQuery(<ProjectsList role="installer" />);
    expect(await screen.findByTestId('projects-empty')).toHaveTextContent('No projects yet');
  });
});

describe('relative time', () => {
  it.each([
    [30, 'just now'],
    [5 * 60, '5 min ago'],
    [2 * 3600, '2 h ago'],
    [3 * 86400, '3 d ago'],
  ])('%i seconds ago reads "%s"', (s, text) => {
    const now = new Date('2025-06-10T12:00:00Z');
    expect(relativeTime(new Date(now.getTime() - s * 1000).toISOString(), now)).toBe(text);
  });

  it('adds a date that cannot be misread', () => {
    expect(lastChangeText('2025-06-08T12:00:00Z', new Date('2025-06-10T12:00:00Z'))).toBe('2 d ago · 8 Jun 2025');
  });
});

describe('new project form', () => {
  it('refuses an empty name with a sentence beside the field', async () => {
    const onSubmit = jest.fn();
    render(<ProjectForm onSubmit={onSubmit} myUnits="metric" />);
    fireEvent.click(screen.getByTestId('project-form-submit'));
    expect(await screen.findByTestId('field-error-name')).toHaveTextContent('Give the project a name.');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('says before sending that an emoji in the name cannot be printed on the sheet, and sends nothing', async () => {
    const onSubmit = jest.fn();
    render(<ProjectForm onSubmit={onSubmit} myUnits="metric" />);
    fireEvent.change(screen.getByTestId('project-form-name'), { target: { value: 'Dock 3 🚚' } });
    fireEvent.click(screen.getByTestId('project-form-submit'));
    expect(await screen.findByTestId('field-error-name')).toHaveTextContent('Emoji cannot be printed on the specification sheet');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('sends a Hebrew, Arabic or Chinese name as typed', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<ProjectForm onSubmit={onSubmit} myUnits="metric" />);
    fireEvent.change(screen.getByTestId('project-form-name'), { target: { value: 'מחסן צפון — مستودع 冷库' } });
    fireEvent.click(screen.getByTestId('project-form-submit'));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledWith(expect.objectContaining({ name: 'מחסן צפון — مستودع 冷库' })));
  });

  it('sends the fields, with "my preference" as no project units', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<ProjectForm onSubmit={onSubmit} myUnits="metric" />);
    fireEvent.change(screen.getByTestId('project-form-name'), { target: { value: ' Dock 3 ' } });
    fireEvent.change(screen.getByTestId('project-form-customer'), { target: { value: 'Invented Foods' } });
    fireEvent.change(screen.getByTestId('project-form-site'), { target: { value: 'Hall 2' } });
    fireEvent.click(screen.getByTestId('project-form-submit'));
    await waitFor(() =>
      expect(onSubmit).toHaveBeenCalledWith({ name: 'Dock 3', customer: 'Invented Foods', site: 'Hall 2', units: null, notes: '' }),
    );
  });

  it("shows the server's field message beside the field", async () => {
    const onSubmit = jest.fn().mockRejectedValue(new ApiError(400, 'Check the highlighted fields.', { name: 'That name is taken here.' }));
    render(<ProjectForm onSubmit={onSubmit} myUnits="imperial" />);
    fireEvent.change(screen.getByTestId('project-form-name'), { target: { value: 'Dock 3' } });
    fireEvent.click(screen.getByTestId('project-form-units-imperial'));
    fireEvent.click(screen.getByTestId('project-form-submit'));
    expect(await screen.findByTestId('field-error-name')).toHaveTextContent('That name is taken here.');
  });
});
