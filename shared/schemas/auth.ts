import { z } from 'zod';
import { email, idParam, newPassword, personName, role, unitSystem } from './common';
import {
  currentPasswordRule,
  newPasswordAgainRule,
  oldPasswordRule,
  passwordAgainRule,
  PASSWORD_UNCHANGED,
  PASSWORDS_DIFFER,
} from './rules';
import { zodText } from './zod-rules';

export const signInBody = z.object({
  email,
  password: zodText(currentPasswordRule),
});
export type SignInBody = z.infer<typeof signInBody>;

export const userDto = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  role,
  disabled: z.boolean(),
  units: unitSystem,
  organizationId: z.number(),
  organizationName: z.string(),
  hasPassword: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type UserDto = z.infer<typeof userDto>;

export const userResponse = z.object({ user: userDto });
export type UserResponse = z.infer<typeof userResponse>;

/** The session probe: who is signed in, or null — being signed out is an answer, not an error. */
export const sessionResponse = z.object({ user: userDto.nullable() });
export type SessionResponse = z.infer<typeof sessionResponse>;

export const usersResponse = z.object({ users: z.array(userDto) });
export type UsersResponse = z.infer<typeof usersResponse>;

/** What a signed-in person may change about themselves. */
export const updateMeBody = z
  .object({ units: unitSystem.optional(), name: personName.optional() })
  .strict()
  .refine((b) => b.units !== undefined || b.name !== undefined, { message: 'Nothing to change.' });
export type UpdateMeBody = z.infer<typeof updateMeBody>;

/** Admin: invite someone by e-mail; they choose their own password through a one-time link. */
export const inviteBody = z.object({ email, name: personName, role }).strict();
export type InviteBody = z.infer<typeof inviteBody>;

export const patchUserBody = z
  .object({ role: role.optional(), disabled: z.boolean({ message: 'Disabled must be true or false.' }).optional() })
  .strict()
  .refine((b) => b.role !== undefined || b.disabled !== undefined, { message: 'Nothing to change: give a role or the disabled flag.' });
export type PatchUserBody = z.infer<typeof patchUserBody>;

export const invitationToken = z
  .string({ message: 'This link is missing its code.' })
  .regex(/^[A-Za-z0-9_-]{32,128}$/, 'This link is not complete. Open it again from the e-mail.');

export const invitationDto = z.object({
  email: z.string(),
  name: z.string(),
  organizationName: z.string(),
  /** invite: a first password; reset: a new one after "forgot password". */
  purpose: z.enum(['invite', 'reset']).optional(),
});
export type InvitationDto = z.infer<typeof invitationDto>;

export const acceptInvitationBody = z
  .object({ token: invitationToken, password: newPassword, confirm: zodText(passwordAgainRule) })
  .strict()
  .refine((b) => b.password === b.confirm, { message: PASSWORDS_DIFFER, path: ['confirm'] });
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBody>;

export const outboxMessageDto = z.object({
  id: z.number(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string(), size: z.number() })),
  receivedAt: z.string(),
  /** Delivery: queued (waiting or retrying), sending, sent, or failed after every retry. */
  status: z.enum(['queued', 'sending', 'sent', 'failed']).optional(),
  attempts: z.number().optional(),
  sentAt: z.string().nullable().optional(),
});
export type OutboxMessageDto = z.infer<typeof outboxMessageDto>;
export const outboxResponse = z.object({ messages: z.array(outboxMessageDto), demo: z.boolean() });
export type OutboxResponse = z.infer<typeof outboxResponse>;

/** `/outbox/:id/attachments/:index`: a message's attachment, by its place in the list (0 first). */
export const outboxAttachmentParams = z.object({
  id: idParam,
  index: z
    .string({ message: 'Say which attachment.' })
    .regex(/^(0|[1-9][0-9]{0,2})$/, 'An attachment is numbered from 0 with digits only, like 0 or 1.')
    .transform((s) => Number(s)),
});

/** Signed in: a new password, with the current one as proof. */
export const changePasswordBody = z
  .object({
    currentPassword: zodText(oldPasswordRule),
    password: newPassword,
    confirm: zodText(newPasswordAgainRule),
  })
  .strict()
  .refine((b) => b.password === b.confirm, { message: PASSWORDS_DIFFER, path: ['confirm'] })
  .refine((b) => b.password !== b.currentPassword, { message: PASSWORD_UNCHANGED, path: ['password'] });
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;

/** Signed out: ask for a one-time link to choose a new password. */
export const forgotPasswordBody = z.object({ email }).strict();
export type ForgotPasswordBody = z.infer<typeof forgotPasswordBody>;

/** The same answer whether or not the address has an account. */
export const FORGOT_PASSWORD_ANSWER =
  'If an account uses that address, a link to choose a new password is on its way. It works once and for 1 hour.';
export const forgotPasswordResponse = z.object({ message: z.string() });
export type ForgotPasswordResponse = z.infer<typeof forgotPasswordResponse>;
