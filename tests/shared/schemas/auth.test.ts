import { acceptInvitationBody, inviteBody, signInBody, updateMeBody } from '../../../shared/schemas';

describe('the shared request schemas', () => {
  it('trims and lower-cases e-mail addresses', () => {
    expect(signInBody.parse({ email: '  Ada.Admin@Example.COM ', password: 'x' }).email).toBe('ada.admin@example.com');
  });

  it('refuses an invitation for a role that does not exist', () => {
    const r = inviteBody.safeParse({ email: 'a@b.example', name: 'A', role: 'owner' });
    expect(r.success).toBe(false);
  });

  it.each([
    ['short', 'short', 'password', 'Use at least 10 characters.'],
    ['long-enough-1', 'long-enough-2', 'confirm', 'The two passwords are not the same.'],
  ])('rejects a new password %s / %s on the %s field', (password, confirm, field, message) => {
    const r = acceptInvitationBody.safeParse({ token: 'a'.repeat(43), password, confirm });
    expect(r.success).toBe(false);
    if (!r.success) {
      const issue = r.error.issues.find((i) => i.path[0] === field);
      expect(issue?.message).toBe(message);
    }
  });

  it('refuses a settings change that changes nothing', () => {
    expect(updateMeBody.safeParse({}).success).toBe(false);
    expect(updateMeBody.safeParse({ units: 'imperial' }).success).toBe(true);
  });
});
