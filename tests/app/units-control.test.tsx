import '@testing-library/jest-dom';
import { fireEvent, render, screen } from '@testing-library/react';
import { UnitsControl } from '@/components/account/units-control';
import { useUpdateMeMutation } from '@/hooks/use-session';

jest.mock('@/hooks/use-session', () => ({ useUpdateMeMutation: jest.fn() }));

const mutate = jest.fn();

beforeEach(() => {
  mutate.mockReset();
  // Only the fields UnitsControl reads; the rest of React Query's result is irrelevant here.
  jest
    .mocked(useUpdateMeMutation)
    .mockReturnValue({ mutate, isPending: false, isError: false, error: null, variables: undefined } as unknown as ReturnType<
      typeof useUpdateMeMutation
    >);
});

describe('UnitsControl', () => {
  it("saves 'imperial' on the user when Imperial is pressed", () => {
    render(<UnitsControl units="metric" />);

    fireEvent.click(screen.getByTestId('units-imperial'));

    expect(mutate).toHaveBeenCalledWith({ units: 'imperial' });
  });

  it('does not save again when the current choice is pressed', () => {
    render(<UnitsControl units="metric" />);

    fireEvent.click(screen.getByTestId('units-metric'));

    expect(mutate).not.toHaveBeenCalled();
  });

  it('marks the saved choice as checked', () => {
    render(<UnitsControl units="imperial" />);

    expect(screen.getByTestId('units-imperial')).toHaveAttribute('aria-checked', 'true');
    expect(screen.getByTestId('units-metric')).toHaveAttribute('aria-checked', 'false');
  });
});
