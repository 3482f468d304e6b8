import '@testing-library/jest-dom';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { CriteriaSettingsForm, parseArcmin } from '@/components/plan/criteria-settings';

const ARCMIN = Math.PI / 10800;
const defaults = { detectRad: 6 * ARCMIN, recogniseRad: 20 * ARCMIN };

describe('the project’s detect and recognise angles', () => {
  it('states both angles and that the defaults are engineering judgement', () => {
    render(<CriteriaSettingsForm criteria={defaults} canEdit onSave={jest.fn()} />);
    const sentence = screen.getByTestId('criteria-sentence');
    expect(sentence).toHaveTextContent('at least 6′');
    expect(sentence).toHaveTextContent('at least 20′');
    expect(sentence).toHaveTextContent('engineering judgement, not a published rule');
  });

  it('saves angles typed in minutes of arc as radians', async () => {
    const onSave = jest.fn();
    render(<CriteriaSettingsForm criteria={defaults} canEdit onSave={onSave} />);
    const user = userEvent.setup();
    await user.clear(screen.getByTestId('criteria-detect'));
    await user.type(screen.getByTestId('criteria-detect'), '4');
    await user.clear(screen.getByTestId('criteria-recognise'));
    await user.type(screen.getByTestId('criteria-recognise'), "30'");
    await user.click(screen.getByTestId('criteria-save'));
    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    expect(onSave.mock.calls[0][0].detectRad).toBeCloseTo(4 * ARCMIN, 15);
    expect(onSave.mock.calls[0][0].recogniseRad).toBeCloseTo(30 * ARCMIN, 15);
  });

  it('refuses a recognise angle smaller than the detect angle with a sentence beside it, and saves nothing', async () => {
    const onSave = jest.fn();
    render(<CriteriaSettingsForm criteria={defaults} canEdit onSave={onSave} />);
    const user = userEvent.setup();
    await user.clear(screen.getByTestId('criteria-recognise'));
    await user.type(screen.getByTestId('criteria-recognise'), '5');
    await user.click(screen.getByTestId('criteria-save'));
    expect(await screen.findByTestId('field-error-recognise')).toHaveTextContent('larger than the detect angle');
    expect(onSave).not.toHaveBeenCalled();
  });

  it('offers the way back to the defaults only when the project has its own angles', async () => {
    const onSave = jest.fn();
    const { rerender } = render(<CriteriaSettingsForm criteria={defaults} canEdit onSave={onSave} />);
    expect(screen.queryByTestId('criteria-defaults')).toBeNull();
    rerender(<CriteriaSettingsForm criteria={{ detectRad: 4 * ARCMIN, recogniseRad: 30 * ARCMIN }} canEdit onSave={onSave} />);
    expect(screen.getByTestId('criteria-sentence')).toHaveTextContent('set for this project');
    await userEvent.setup().click(screen.getByTestId('criteria-defaults'));
    expect(onSave).toHaveBeenCalledWith(undefined);
  });

  it('shows the angles but no fields to someone who may not edit the project', () => {
    render(<CriteriaSettingsForm criteria={defaults} canEdit={false} onSave={jest.fn()} />);
    expect(screen.getByTestId('criteria-sentence')).toBeInTheDocument();
    expect(screen.queryByTestId('criteria-detect')).toBeNull();
  });

  it.each([
    ['6', 6],
    ['6′', 6],
    ["7,5'", 7.5],
    ['12 arcmin', 12],
    ['six', null],
    ['-3', null],
  ])('reads "%s" as %s minutes of arc', (text, expected) => {
    expect(parseArcmin(text)).toBe(expected);
  });
});
