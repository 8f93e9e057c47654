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
  password: z
    .string({ error: 'Enter your password.' })
    .min(1, 'Enter your password.')
    .max(PASSWORD_MAX, `A password has at most ${PASSWORD_MAX} characters.`),
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
