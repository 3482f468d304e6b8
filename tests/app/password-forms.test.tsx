import '@testing-library/jest-dom';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ChangePasswordForm, PASSWORD_CHANGED } from '@/components/forms/change-password-form';
import { ForgotPasswordForm } from '@/components/forms/forgot-password-form';
import { ApiError } from '@/shared/api-client';
import { FORGOT_PASSWORD_ANSWER } from '@/shared/schemas';

describe('ChangePasswordForm', () => {
  it('asks for the current password before asking the server', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<ChangePasswordForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('change-password-new'), 'a long enough phrase');
    await user.type(screen.getByTestId('change-password-confirm'), 'a long enough phrase');
    await user.click(screen.getByTestId('change-password-submit'));

    expect(await screen.findByTestId('field-error-currentPassword')).toHaveTextContent('Enter your current password.');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it("puts the server's word about the current password beside that field", async () => {
    const onSubmit = jest.fn().mockRejectedValue(
      new ApiError(400, 'Your current password is not right; nothing was changed.', {
        currentPassword: 'This is not your current password.',
      }),
    );
    render(<ChangePasswordForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('change-password-current'), 'a wrong guess');
    await user.type(screen.getByTestId('change-password-new'), 'a long enough phrase');
    await user.type(screen.getByTestId('change-password-confirm'), 'a long enough phrase{Enter}');

    expect(await screen.findByTestId('field-error-currentPassword')).toHaveTextContent('This is not your current password.');
    expect(screen.getByTestId('change-password-error')).toHaveTextContent('nothing was changed');
  });

  it('says the password changed and empties the fields', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<ChangePasswordForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('change-password-current'), 'the old phrase here');
    await user.type(screen.getByTestId('change-password-new'), 'a long enough phrase');
    await user.type(screen.getByTestId('change-password-confirm'), 'a long enough phrase{Enter}');

    expect(await screen.findByTestId('change-password-done')).toHaveTextContent(PASSWORD_CHANGED);
    expect(onSubmit).toHaveBeenCalledWith({
      currentPassword: 'the old phrase here',
      password: 'a long enough phrase',
      confirm: 'a long enough phrase',
    });
    expect(screen.getByTestId('change-password-current')).toHaveValue('');
  });
});

describe('ForgotPasswordForm', () => {
  it('refuses an incomplete address beside the field', async () => {
    const onSubmit = jest.fn();
    render(<ForgotPasswordForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('forgot-password-email'), 'ines@{Enter}');

    expect(await screen.findByTestId('field-error-email')).toHaveTextContent('Enter a full e-mail address, like name@company.com.');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it("shows the server's answer, which never says whether the address has an account", async () => {
    const onSubmit = jest.fn().mockResolvedValue({ message: FORGOT_PASSWORD_ANSWER });
    render(<ForgotPasswordForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('forgot-password-email'), ' ines@sightfan-demo.example {Enter}');

    expect(await screen.findByTestId('forgot-password-done')).toHaveTextContent(FORGOT_PASSWORD_ANSWER);
    expect(onSubmit).toHaveBeenCalledWith({ email: 'ines@sightfan-demo.example' });
  });
});
