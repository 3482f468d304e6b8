import '@testing-library/jest-dom';
import { act, fireEvent, screen, waitFor } from '@testing-library/react';
import { PlacementEditor } from '@/components/placement/placement-editor';
import { api } from '@/hooks/api';
import { usePlacementWrites } from '@/hooks/use-placement-writes';
import { usePlanEvaluation } from '@/hooks/use-plan-evaluation';
import { projectKeys, useProjectQuery } from '@/hooks/use-projects';
import { ApiError } from '@/shared/api-client';
import { evaluateProject } from '@/shared/project-optics';
import type { PlacementDto, ProjectDto } from '@/shared/schemas';
import { formatLength } from '@/shared/units';
import { makeTestQueryClient, renderWithQuery } from './render';
import { TEST_AISLE_SCENE, TEST_CATALOGUE, testPlacement, testProject } from './fixtures';

jest.mock('@/hooks/api', () => ({
  api: { projects: { get: jest.fn(), updatePlacement: jest.fn(), removePlacement: jest.fn(), list: jest.fn() } },
}));

const catalogue = TEST_CATALOGUE;
const placement: PlacementDto = testPlacement();
const project: ProjectDto = testProject({
  scene: TEST_AISLE_SCENE,
  placements: [placement],
});

/** Reads the project from the cache, as the project screen does, so saves and 409s flow back in. */
function Harness({ onClose }: { onClose?: () => void }) {
  const q = useProjectQuery(3);
  if (!q.data) return null;
  return <Fed project={q.data} onClose={onClose} />;
}

/** Feeds the editor as the plan does: the shared write path and the plan's evaluation of its placements. */
function Fed({ project: p, onClose }: { project: ProjectDto; onClose?: () => void }) {
  const writes = usePlacementWrites(p);
  const evaluation = usePlanEvaluation(p.scene, writes.placements, catalogue);
  const live = writes.placements.find((x) => x.id === 7) ?? null;
  return (
    <PlacementEditor
      project={p}
      scene={p.scene}
      placement={live}
      writes={writes}
      evaluation={evaluation}
      catalogue={catalogue}
      units="imperial"
      canEdit
      onClose={onClose}
    />
  );
}

function renderEditor(onClose?: () => void) {
  const client = makeTestQueryClient();
  client.setQueryData(projectKeys.detail(3), project);
  jest.mocked(api.projects.get).mockResolvedValue({ project });
  return renderWithQuery(<Harness onClose={onClose} />, client);
}

const eyeDistanceFor = (heightM: number) =>
  formatLength(
    evaluateProject({ scene: project.scene, placements: [{ ...placement, heightM }], catalogue }).placements[0].numbers!.eyeDistanceM,
    'imperial',
  );

beforeEach(() => jest.clearAllMocks());

describe('PlacementEditor', () => {
  it('recomputes the numbers as soon as a height is typed, before anything is saved', () => {
    renderEditor();
    expect(screen.getByTestId('numbers-eye-distance')).toHaveTextContent(eyeDistanceFor(2.6));

    fireEvent.change(screen.getByTestId('placement-height'), { target: { value: '9 ft' } });

    expect(screen.getByTestId('numbers-eye-distance')).toHaveTextContent(eyeDistanceFor(9 * 0.3048));
    expect(api.projects.updatePlacement).not.toHaveBeenCalled();
  });

  it('saves a metric value typed in imperial mode, in metres, with the version it edits', async () => {
    jest
      .mocked(api.projects.updatePlacement)
      .mockResolvedValue({ placement: { ...placement, heightM: 3.2, version: 5 }, projectVersion: 9 });
    renderEditor();

    fireEvent.change(screen.getByTestId('placement-height'), { target: { value: '3.2 m' } });
    fireEvent.click(screen.getByTestId('placement-save'));

    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenCalledWith(3, 7, { heightM: 3.2, version: 4 }));
    await waitFor(() => expect(screen.getByTestId('placement-save-status')).toHaveTextContent('All changes saved.'));
  });

  /** Types 10 ft and saves; the server answers 409 with someone else's 8 ft (version 5). */
  async function heightConflict() {
    const theirs = { ...placement, heightM: 2.4384, version: 5 };
    jest.mocked(api.projects.updatePlacement).mockRejectedValue(new ApiError(409, 'Changed elsewhere.', {}, undefined, theirs));
    renderEditor();
    fireEvent.change(screen.getByTestId('placement-height'), { target: { value: '10 ft' } });
    fireEvent.click(screen.getByTestId('placement-save'));
    await screen.findByTestId('placement-conflict');
    return theirs;
  }

  it("keeps the typed value and shows the server's on a 409", async () => {
    await heightConflict();
    expect(screen.getByTestId('placement-conflict-theirs-values')).toHaveTextContent(`height ${formatLength(2.4384, 'imperial')}`);
    expect(screen.getByTestId('placement-height')).toHaveValue('10 ft');

    jest
      .mocked(api.projects.updatePlacement)
      .mockResolvedValue({ placement: { ...placement, heightM: 10 * 0.3048, version: 6 }, projectVersion: 9 });
    fireEvent.click(screen.getByTestId('placement-conflict-keep'));
    await waitFor(() => expect(api.projects.updatePlacement).toHaveBeenLastCalledWith(3, 7, { heightM: 10 * 0.3048, version: 5 }));
  });

  it('keeps a change made after a conflict, says it is not saved, and saves it with the first when the person keeps their own values', async () => {
    const theirs = await heightConflict();
    fireEvent.change(screen.getByTestId('placement-tilt'), { target: { value: '20°' } });

    expect(screen.getByTestId('placement-conflict-mine-values')).toHaveTextContent('tilt 20');
    expect(screen.getByTestId('placement-save-status')).toHaveTextContent('Not saved: changed elsewhere.');
    expect(api.projects.updatePlacement).toHaveBeenCalledTimes(1);

    jest.mocked(api.projects.updatePlacement).mockResolvedValue({
      placement: { ...theirs, heightM: 10 * 0.3048, tiltDownRad: (20 * Math.PI) / 180, version: 6 },
      projectVersion: 9,
    });
    fireEvent.click(screen.getByTestId('placement-conflict-keep'));
    await waitFor(() =>
      expect(api.projects.updatePlacement).toHaveBeenLastCalledWith(3, 7, {
        heightM: 10 * 0.3048,
        tiltDownRad: (20 * Math.PI) / 180,
        version: 5,
      }),
    );
  });

  it('says why a typed height cannot be read, and does not save it', () => {
    renderEditor();
    const field = screen.getByTestId('placement-height');

    fireEvent.change(field, { target: { value: 'tall' } });
    fireEvent.blur(field);

    expect(screen.getByTestId('field-error-heightM')).toHaveTextContent(/not a length we can read/);
    expect(screen.getByTestId('placement-save')).toHaveAttribute('aria-disabled', 'true');
  });

  it('asks before removing the mirror, then removes it', async () => {
    jest.mocked(api.projects.removePlacement).mockResolvedValue({ projectVersion: 9 });
    const onClose = jest.fn();
    renderEditor(onClose);

    fireEvent.click(screen.getByTestId('placement-delete'));
    expect(api.projects.removePlacement).not.toHaveBeenCalled();
    await act(async () => {
      fireEvent.click(screen.getByTestId('placement-delete-confirm'));
    });

    await waitFor(() => expect(api.projects.removePlacement).toHaveBeenCalledWith(3, 7));
    await waitFor(() => expect(onClose).toHaveBeenCalled());
  });

  it('shows the safety cautions beside the numbers', () => {
    renderEditor();
    expect(screen.getByTestId('safety-cautions')).toHaveTextContent(
      'Objects in a convex mirror appear smaller and farther away than they are',
    );
    expect(screen.getByTestId('safety-cautions')).toHaveTextContent('which take precedence');
  });
});
