/** The placement editor's parts on their own: the delete confirmation, the save status and the form's viewers. */
import '@testing-library/jest-dom';
import { act, fireEvent, render, screen } from '@testing-library/react';
import { PlacementDelete } from '@/components/placement/placement-delete';
import { PlacementForm } from '@/components/placement/placement-form';
import { PlacementLiveNumbers } from '@/components/placement/placement-live-numbers';
import { saveStatusText } from '@/components/placement/placement-save-state';
import { ApiError } from '@/shared/api-client';
import { TEST_CATALOGUE, testPlacement } from './fixtures';

describe('removing a mirror', () => {
  it('sends nothing when the person keeps it', () => {
    const onRemove = jest.fn(() => Promise.resolve());
    render(<PlacementDelete label="M1" removing={false} onRemove={onRemove} onRemoved={jest.fn()} />);
    fireEvent.click(screen.getByTestId('placement-delete'));
    expect(screen.getByTestId('placement-delete-confirmation')).toHaveTextContent('Remove “M1” from this project? This cannot be undone.');
    fireEvent.click(screen.getByTestId('placement-delete-cancel'));
    expect(onRemove).not.toHaveBeenCalled();
    expect(screen.queryByTestId('placement-delete-confirmation')).toBeNull();
  });

  it('says why when the removal fails and keeps the question open, without closing the editor', async () => {
    const onRemoved = jest.fn();
    const onRemove = jest.fn(() => Promise.reject(new ApiError(404, 'This mirror is not in the project.', {})));
    render(<PlacementDelete label="M1" removing={false} onRemove={onRemove} onRemoved={onRemoved} />);
    fireEvent.click(screen.getByTestId('placement-delete'));
    await act(async () => fireEvent.click(screen.getByTestId('placement-delete-confirm')));
    expect(screen.getByTestId('placement-delete-confirmation')).toHaveTextContent('This mirror is not in the project.');
    expect(onRemoved).not.toHaveBeenCalled();
  });
});

describe('the save status', () => {
  it('names a conflict rather than a plain failure, and says saving while a save runs', () => {
    expect(saveStatusText({ dirty: true, saving: false, error: 'Refused.', conflict: true })).toBe('Not saved: changed elsewhere.');
    expect(saveStatusText({ dirty: true, saving: true, error: null, conflict: true })).toBe('Saving…');
    expect(saveStatusText({ dirty: false, saving: false, error: 'Refused.', conflict: false })).toBe('Not saved.');
    expect(saveStatusText({ dirty: true, saving: false, error: null, conflict: false })).toBe('Unsaved changes; saving shortly.');
    expect(saveStatusText({ dirty: false, saving: false, error: null, conflict: false })).toBe('All changes saved.');
  });
});

describe('the placement form', () => {
  it('offers every viewer it is given, a viewer placed but not yet saved included, and reports the choice', () => {
    const onChange = jest.fn();
    render(
      <PlacementForm
        placement={testPlacement({ viewerId: null })}
        viewers={[
          { id: 'v1', name: 'Driver', positionM: [0, 0], eyeHeightM: 2.1 },
          { id: 'v-new', name: 'Viewer 2', positionM: [4, 4], eyeHeightM: 1.6 },
        ]}
        catalogue={TEST_CATALOGUE}
        units="metric"
        canEdit
        errors={{}}
        onChange={onChange}
        onCommit={jest.fn()}
      />,
    );
    fireEvent.click(screen.getByTestId('placement-viewer-v-new'));
    expect(onChange).toHaveBeenCalledWith({ viewerId: 'v-new' });
  });

  it('shows the server’s sentence beside the field it names', () => {
    render(
      <PlacementForm
        placement={testPlacement()}
        viewers={[]}
        catalogue={TEST_CATALOGUE}
        units="metric"
        canEdit
        errors={{ tiltDownRad: 'A sentence from the server about the tilt.' }}
        onChange={jest.fn()}
        onCommit={jest.fn()}
      />,
    );
    expect(screen.getByTestId('field-error-tiltDownRad')).toHaveTextContent('A sentence from the server about the tilt.');
  });
});

describe('the live numbers', () => {
  it('say, beside the numbers, that a mirror is mounted above the top of the wall it hangs on', () => {
    const placement = testPlacement({ label: 'M9', positionM: [0.2, 0], heightM: 3, azimuthRad: 0 });
    const scene = {
      walls: [{ id: 'w', kind: 'wall' as const, aM: [0, -2] as [number, number], bM: [0, 2] as [number, number], heightM: 2 }],
      zones: [],
      viewers: [],
    };
    render(<PlacementLiveNumbers placementId={placement.id} placement={placement} evaluation={null} scene={scene} units="metric" />);
    expect(screen.getByTestId('placement-plausibility')).toHaveTextContent(
      '“M9” is mounted at 3.00 m, above the top of wall W1, which is 2.00 m high.',
    );
  });

  it('say nothing of the kind when the wall reaches the mirror', () => {
    const placement = testPlacement({ positionM: [0.2, 0], heightM: 1.5, azimuthRad: 0 });
    const scene = {
      walls: [{ id: 'w', kind: 'wall' as const, aM: [0, -2] as [number, number], bM: [0, 2] as [number, number], heightM: 2 }],
      zones: [],
      viewers: [],
    };
    render(<PlacementLiveNumbers placementId={placement.id} placement={placement} evaluation={null} scene={scene} units="metric" />);
    expect(screen.queryByTestId('placement-plausibility')).toBeNull();
  });
});
