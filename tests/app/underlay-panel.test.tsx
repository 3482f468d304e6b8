/**
 * The customer's plan in the plan's details: what it says about the scale, the changes its buttons
 * hand to the workspace, the confirmation before removing, and a reviewer's read-only view; and the
 * calibration card's steps.
 */
import '@testing-library/jest-dom';
import { fireEvent, screen } from '@testing-library/react';
import { CalibrationPrompt } from '@/components/plan/underlay-calibration';
import { calibrateUnderlay, newUnderlay } from '@/components/plan/underlay-edits';
import { UnderlayPanel, type UnderlayPanelProps } from '@/components/plan/underlay-panel';
import { underlayToPlan } from '@/shared/geometry/underlay';
import type { FileDto, Underlay } from '@/shared/schemas/files';
import { renderWithQuery } from './render';

/** An invented plan of an invented job 7. */
const PLAN: FileDto = {
  id: 'plan-1',
  projectId: 7,
  kind: 'plan',
  contentType: 'image/png',
  bytes: 400_000,
  name: 'unit-4-ground-floor.pdf',
  widthPx: 2000,
  heightPx: 1400,
  placementId: null,
  sourcePage: 2,
  sourcePages: 6,
  createdAt: '2026-12-02T10:00:00.000Z',
  url: '/api/files/plan-1',
  thumbnailUrl: '/api/files/plan-1/thumbnail',
};

function renderPanel(over: Partial<UnderlayPanelProps> = {}) {
  const props: UnderlayPanelProps = {
    projectId: 7,
    canEdit: true,
    underlay: newUnderlay(PLAN),
    file: PLAN,
    units: 'metric',
    calibrating: false,
    onChange: jest.fn(),
    onUploaded: jest.fn(),
    onCalibrate: jest.fn(),
    onRemove: jest.fn(),
    ...over,
  };
  renderWithQuery(<UnderlayPanel {...props} />);
  return props;
}

describe('the customer’s plan panel', () => {
  it('names the file and its PDF page, and says a new plan is not calibrated yet', () => {
    renderPanel();
    expect(screen.getByTestId('underlay-name')).toHaveTextContent('unit-4-ground-floor.pdf, page 2 of 6');
    expect(screen.getByTestId('underlay-scale')).toHaveTextContent('Not calibrated yet');
    expect(screen.getByRole('button', { name: 'Calibrate the scale' })).toBeInTheDocument();
  });

  it('states the calibrated distance in the person’s units once calibrated', () => {
    const u = calibrateUnderlay(newUnderlay(PLAN), [100, 100], [1100, 100], 3.81);
    renderPanel({ underlay: u, units: 'imperial' });
    expect(screen.getByTestId('underlay-scale')).toHaveTextContent(/Calibrated: 12 ft 6 in between the two points/);
    expect(screen.getByTestId('underlay-scale')).toHaveTextContent('3.8 mm per pixel');
  });

  it('hands a move east by the nudge to the workspace, and the plan’s pixels move with it', () => {
    const u = newUnderlay(PLAN);
    const { onChange } = renderPanel({ underlay: u });
    fireEvent.click(screen.getByTestId('underlay-move-east'));
    const next = (onChange as jest.Mock).mock.calls[0][0] as Underlay;
    expect(underlayToPlan(next, [10, 10])[0] - underlayToPlan(u, [10, 10])[0]).toBeCloseTo(0.1, 9);
    expect(underlayToPlan(next, [10, 10])[1]).toBeCloseTo(underlayToPlan(u, [10, 10])[1], 9);
  });

  it('hands the chosen opacity to the workspace', () => {
    const { onChange } = renderPanel();
    fireEvent.click(screen.getByTestId('underlay-opacity-25'));
    expect((onChange as jest.Mock).mock.calls[0][0].opacity).toBe(0.25);
  });

  it('removes the plan only after the confirmation', () => {
    const { onRemove } = renderPanel();
    fireEvent.click(screen.getByTestId('underlay-remove'));
    fireEvent.click(screen.getByTestId('underlay-remove-cancel'));
    expect(onRemove).not.toHaveBeenCalled();
    fireEvent.click(screen.getByTestId('underlay-remove'));
    fireEvent.click(screen.getByTestId('underlay-remove-confirm'));
    expect(onRemove).toHaveBeenCalledTimes(1);
  });

  it('refuses a page that is not a whole number from 1 before anything is sent', () => {
    renderPanel({ underlay: undefined });
    fireEvent.change(screen.getByTestId('underlay-page'), { target: { value: '0' } });
    expect(screen.getByText('The page is a whole number from 1.')).toBeInTheDocument();
    expect(screen.getByTestId('underlay-upload-choose')).toHaveAttribute('aria-disabled', 'true');
  });

  it('shows a reviewer the plan and its scale with no control to change them', () => {
    renderPanel({ canEdit: false });
    expect(screen.getByTestId('underlay-scale')).toBeInTheDocument();
    for (const id of ['underlay-calibrate', 'underlay-move-east', 'underlay-remove', 'underlay-upload-choose']) {
      expect(screen.queryByTestId(id)).toBeNull();
    }
  });
});

describe('the calibration card', () => {
  it('asks for each tap in turn and the distance only once both points are down', () => {
    const props = { units: 'metric' as const, onSet: jest.fn(() => null), onRestart: jest.fn(), onCancel: jest.fn() };
    const { rerender } = renderWithQuery(<CalibrationPrompt points={0} {...props} />);
    expect(screen.getByTestId('underlay-calibration')).toHaveTextContent('step 1 of 3');
    expect(screen.getByTestId('underlay-calibration-step')).toHaveTextContent('Tap one end');
    expect(screen.queryByTestId('underlay-calibration-distance')).toBeNull();
    rerender(<CalibrationPrompt points={2} {...props} />);
    expect(screen.getByTestId('underlay-calibration')).toHaveTextContent('step 3 of 3');
    fireEvent.change(screen.getByTestId('underlay-calibration-distance'), { target: { value: '12 ft 6 in' } });
    fireEvent.click(screen.getByTestId('underlay-calibration-set'));
    expect(props.onSet).toHaveBeenCalledWith('12 ft 6 in');
  });

  it('shows the sentence that stopped the calibration beside the distance', () => {
    const said = 'Enter a length, e.g. 3.8 m.';
    renderWithQuery(<CalibrationPrompt points={2} units="metric" onSet={() => said} onRestart={jest.fn()} onCancel={jest.fn()} />);
    fireEvent.click(screen.getByTestId('underlay-calibration-set'));
    expect(screen.getByTestId('field-error-underlayDistance')).toHaveTextContent(said);
  });
});
