import '@testing-library/jest-dom';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { SignInForm } from '@/components/forms/sign-in-form';
import { ApiError } from '@/shared/api-client';
import { currentPasswordRule, emailRule } from '@/shared/schemas/rules';

describe('SignInForm', () => {
  it('shows a message beside each empty field and does not submit', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<SignInForm onSubmit={onSubmit} />);

    fireEvent.click(screen.getByTestId('sign-in-submit'));

    expect(await screen.findByTestId('field-error-email')).toHaveTextContent(emailRule.required!);
    expect(screen.getByTestId('field-error-password')).toHaveTextContent(currentPasswordRule.required!);
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it("shows the server's field message beside the field and its sentence above the button", async () => {
    const onSubmit = jest
      .fn()
      .mockRejectedValue(new ApiError(401, 'That e-mail and password do not match an account.', { password: 'Check the password.' }));
    render(<SignInForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('sign-in-email'), 'ines.installer@sightfan-demo.example');
    await user.type(screen.getByTestId('sign-in-password'), 'wrong-password');
    await user.click(screen.getByTestId('sign-in-submit'));

    expect(await screen.findByTestId('sign-in-error')).toHaveTextContent('That e-mail and password do not match an account.');
    expect(screen.getByTestId('field-error-password')).toHaveTextContent('Check the password.');
    expect(screen.queryByTestId('field-error-email')).not.toBeInTheDocument();
  });

  it("keeps the server's field message after the field loses focus, and drops it once the field is edited", async () => {
    const onSubmit = jest
      .fn()
      .mockRejectedValue(new ApiError(400, 'Check the highlighted fields.', { email: 'No account uses this address.' }));
    render(<SignInForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('sign-in-email'), 'nobody@sightfan-demo.example');
    await user.type(screen.getByTestId('sign-in-password'), 'demo-password-1');
    await user.click(screen.getByTestId('sign-in-submit'));
    await screen.findByTestId('field-error-email');
    await user.click(screen.getByTestId('sign-in-email'));
    await user.tab();

    expect(screen.getByTestId('field-error-email')).toHaveTextContent('No account uses this address.');

    await user.type(screen.getByTestId('sign-in-email'), 'x');

    await waitFor(() => expect(screen.queryByTestId('field-error-email')).not.toBeInTheDocument());
  });

  it('adds how long to wait when the server says there were too many attempts', async () => {
    const onSubmit = jest.fn().mockRejectedValue(new ApiError(429, 'Too many sign-in attempts.', {}, 30));
    render(<SignInForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('sign-in-email'), 'ines.installer@sightfan-demo.example');
    await user.type(screen.getByTestId('sign-in-password'), 'demo-password-1');
    await user.click(screen.getByTestId('sign-in-submit'));

    expect(await screen.findByTestId('sign-in-error')).toHaveTextContent('Too many sign-in attempts. Try again in 30 seconds.');
  });

  it('submits the trimmed e-mail and the password when Enter is pressed in the password field', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<SignInForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('sign-in-email'), '  ines.installer@sightfan-demo.example ');
    await user.type(screen.getByTestId('sign-in-password'), 'demo-password-1{Enter}');

    await waitFor(() =>
      expect(onSubmit).toHaveBeenCalledWith({ email: 'ines.installer@sightfan-demo.example', password: 'demo-password-1' }),
    );
  });

  it('labels its fields and marks them for password managers', () => {
    render(<SignInForm onSubmit={jest.fn()} />);

    expect(screen.getByLabelText('E-mail')).toHaveAttribute('autocomplete', 'email');
    expect(screen.getByLabelText('Password')).toHaveAttribute('autocomplete', 'current-password');
    expect(screen.getByLabelText('Password')).toHaveAttribute('type', 'password');
  });
});
