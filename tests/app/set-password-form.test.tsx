import '@testing-library/jest-dom';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SetPasswordForm } from '@/components/forms/set-password-form';
import { ApiError } from '@/shared/api-client';

describe('SetPasswordForm', () => {
  it('says so when the two passwords differ, without asking the server', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<SetPasswordForm email="new.person@sightfan-demo.example" onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('set-password-password'), 'a long enough phrase');
    await user.type(screen.getByTestId('set-password-confirm'), 'a different phrase');
    await user.click(screen.getByTestId('set-password-submit'));

    expect(await screen.findByTestId('field-error-confirm')).toHaveTextContent('The two passwords are not the same.');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it("puts the server's message about the password beside the password field", async () => {
    const onSubmit = jest
      .fn()
      .mockRejectedValue(
        new ApiError(400, 'Check the highlighted fields.', { password: 'That password is on a list of leaked passwords.' }),
      );
    render(<SetPasswordForm email="new.person@sightfan-demo.example" onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('set-password-password'), 'password1234');
    await user.type(screen.getByTestId('set-password-confirm'), 'password1234{Enter}');

    expect(await screen.findByTestId('field-error-password')).toHaveTextContent('That password is on a list of leaked passwords.');
    expect(screen.getByTestId('set-password-error')).toHaveTextContent('Check the highlighted fields.');
  });

  it('offers the invited address to password managers as the user name', () => {
    render(<SetPasswordForm email="new.person@sightfan-demo.example" onSubmit={jest.fn()} />);

    expect(screen.getByTestId('set-password-email')).toHaveAttribute('autocomplete', 'username');
    expect(screen.getByTestId('set-password-password')).toHaveAttribute('autocomplete', 'new-password');
  });
});
