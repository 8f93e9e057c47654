import { z } from 'zod';
import { NAME_MAX } from './limits';
import { zEmail } from './auth';
import { zRole } from './roles';

const zName = z.string({ error: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(NAME_MAX, `A name has at most ${NAME_MAX} characters.`);

const zRoles = z
  .array(zRole, { error: 'Pick at least one role.' })
  .min(1, 'Pick at least one role.')
  .refine((r) => new Set(r).size === r.length, 'Each role at most once.');

export const zCreateUser = z.strictObject({
  email: zEmail,
  name: zName,
  roles: zRoles,
});
export type CreateUserInput = z.input<typeof zCreateUser>;

export const zUpdateUser = z
  .strictObject({
    name: zName.optional(),
    roles: zRoles.optional(),
    active: z.boolean().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Send at least one of name, roles or active.');
export type UpdateUserInput = z.input<typeof zUpdateUser>;

export const zUserDto = z.object({
  id: z.number(),
  email: z.string(),
  name: z.string(),
  roles: z.array(zRole),
  active: z.boolean(),
  /** True until the user has set a password from the invitation. */
  invitationPending: z.boolean(),
  createdAt: z.string(),
  lastSignInAt: z.string().nullable(),
});
export type UserDto = z.infer<typeof zUserDto>;

export const zOutboxMessageDto = z.object({
  id: z.number(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string().nullable(),
});
export type OutboxMessageDto = z.infer<typeof zOutboxMessageDto>;
