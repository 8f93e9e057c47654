import { z } from 'zod';
import { EMAIL_MAX, PASSWORD_MAX, TOKEN_MAX } from './limits';
import { normalisePassword, zNewPassword, zNewPasswordFor } from './password-policy';
import { zRole } from './roles';

export const zEmail = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .min(1, 'Enter an e-mail address.')
  .max(EMAIL_MAX, `An e-mail address has at most ${EMAIL_MAX} characters.`)
  .pipe(z.email('Enter a valid e-mail address, like name@example.com.'))
  .transform((v) => v.toLowerCase());

export const zLogin = z.strictObject({
  email: zEmail,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(PASSWORD_MAX, `A password has at most ${PASSWORD_MAX} characters.`),
});
export type LoginInput = z.input<typeof zLogin>;
export type LoginOutput = z.output<typeof zLogin>;

/** The set-password form for this person (from the link): the policy, checked before sending. */
export function zSetPasswordFormFor(person: { email?: string; name?: string }) {
  return z
    .strictObject({
      token: z.string().min(1, 'The link is missing its token.').max(TOKEN_MAX),
      password: zNewPasswordFor(person),
      confirmPassword: z.string().transform(normalisePassword),
    })
    .refine((v) => v.password === v.confirmPassword, {
      path: ['confirmPassword'],
      message: 'The two passwords differ.',
    });
}
export type SetPasswordFormInput = z.input<ReturnType<typeof zSetPasswordFormFor>>;

export const zSetPassword = z.strictObject({
  token: z.string().min(1).max(TOKEN_MAX),
  password: zNewPassword,
});

/** "Forgot your password?": the address to send a reset link to. */
export const zForgotPassword = z.strictObject({ email: zEmail });
export type ForgotPasswordInput = z.input<typeof zForgotPassword>;

/** What the server answers to every reset request, whether or not the address has an account. */
export const RESET_REQUESTED_MESSAGE =
  'If an account uses this address, a link to choose a new password is on its way to it. The link works once, for an hour. Nothing arrived? Check the spam folder, or ask again in a few minutes.';

/** Changing the password from the profile: the current one proves it is you. */
export const zChangePassword = z.strictObject({
  currentPassword: zLogin.shape.password,
  newPassword: zNewPassword,
});

/** The profile's change-password form for this person: the policy, checked before sending. */
export function zChangePasswordFormFor(person: { email?: string; name?: string }) {
  return z
    .strictObject({
      currentPassword: z.string().min(1, 'Enter your current password.').max(PASSWORD_MAX, `A password has at most ${PASSWORD_MAX} characters.`),
      newPassword: zNewPasswordFor(person),
      confirmPassword: z.string().transform(normalisePassword),
    })
    .refine((v) => v.newPassword === v.confirmPassword, { path: ['confirmPassword'], message: 'The two passwords differ.' })
    .refine((v) => v.newPassword !== normalisePassword(v.currentPassword), { path: ['newPassword'], message: 'Choose a password other than your current one.' });
}

/** Joining another organisation with an existing account: its own password confirms it. */
export const zAcceptInvitation = z.strictObject({
  token: z.string().min(1).max(TOKEN_MAX),
  password: zLogin.shape.password,
});

export const zMembershipDto = z.object({
  organisationId: z.number(),
  organisationName: z.string(),
  roles: z.array(zRole),
});

export const zSessionUser = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  roles: z.array(zRole),
  organisation: z.object({ id: z.number(), name: z.string() }),
});
export type SessionUser = z.infer<typeof zSessionUser>;
