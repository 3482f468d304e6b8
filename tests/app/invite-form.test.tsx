import '@testing-library/jest-dom';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { InviteForm } from '@/components/forms/invite-form';
import { ApiError } from '@/shared/api-client';
import { ROLE_MESSAGE } from '@/shared/schemas/rules';

describe('InviteForm', () => {
  it('asks for a role instead of choosing one for the admin', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<InviteForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('invite-email'), 'new.person@sightfan-demo.example');
    await user.type(screen.getByTestId('invite-name'), 'New Person');
    await user.click(screen.getByTestId('invite-submit'));

    expect(await screen.findByTestId('field-error-role')).toHaveTextContent(ROLE_MESSAGE);
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('sends e-mail, name and the chosen role, then confirms and clears the form', async () => {
    const onSubmit = jest.fn().mockResolvedValue(undefined);
    render(<InviteForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('invite-email'), 'new.person@sightfan-demo.example');
    await user.type(screen.getByTestId('invite-name'), 'New Person');
    await user.click(screen.getByTestId('invite-role-reviewer'));
    await user.click(screen.getByTestId('invite-submit'));

    await waitFor(() =>
      expect(onSubmit).toHaveBeenCalledWith({ email: 'new.person@sightfan-demo.example', name: 'New Person', role: 'reviewer' }),
    );
    expect(await screen.findByTestId('invite-sent')).toHaveTextContent(
      'Invitation for New Person <new.person@sightfan-demo.example> is queued and goes out at once when the mail server answers.',
    );
    expect(screen.getByTestId('invite-email')).toHaveValue('');
  });

  it("shows the server's objection to the e-mail beside the e-mail field", async () => {
    const onSubmit = jest
      .fn()
      .mockRejectedValue(
        new ApiError(409, 'Someone with that e-mail is already in Sightfan.', { email: 'This address is already in use.' }),
      );
    render(<InviteForm onSubmit={onSubmit} />);
    const user = userEvent.setup();

    await user.type(screen.getByTestId('invite-email'), 'ines.installer@sightfan-demo.example');
    await user.type(screen.getByTestId('invite-name'), 'Ines Again');
    await user.click(screen.getByTestId('invite-role-installer'));
    await user.click(screen.getByTestId('invite-submit'));

    expect(await screen.findByTestId('field-error-email')).toHaveTextContent('This address is already in use.');
    expect(screen.getByTestId('invite-error')).toHaveTextContent('Someone with that e-mail is already in Sightfan.');
  });
});
