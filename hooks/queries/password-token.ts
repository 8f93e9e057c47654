/**
 * One's own password: who a set-password or reset link is for and setting the password from it,
 * asking for a reset link, changing the password from the profile.
 */
import { useMutation, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { ForgotPasswordInput } from '../../constants/schemas/auth';
import { apiOrThrow } from '../api-client';

export const passwordTokenKeys = {
  all: ['password-token'] as const,
  detail: (token: string) => [...passwordTokenKeys.all, token] as const,
};

const zTokenOwner = z.object({
  /** An invitation (first password, or joining with an existing account) or a reset. */
  purpose: z.enum(['invitation', 'reset']).default('invitation'),
  email: z.string(),
  name: z.string(),
  /** The link joins an existing account to an organisation: confirm with its password. */
  existingAccount: z.boolean().default(false),
  organisationName: z.string().optional(),
});
const zPasswordSet = z.object({ email: z.string() });

export function usePasswordTokenQuery(token: string) {
  return useQuery({
    queryKey: passwordTokenKeys.detail(token),
    queryFn: ({ signal }) => apiOrThrow(`/api/auth/password-token/${encodeURIComponent(token)}`, { schema: zTokenOwner, signal }),
    enabled: token.length > 0,
    staleTime: Infinity,
  });
}

export function useSetPasswordMutation() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) => apiOrThrow('/api/auth/set-password', { method: 'POST', body: input, schema: zPasswordSet }),
  });
}

export function useAcceptInvitationMutation() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) => apiOrThrow('/api/auth/accept-invitation', { method: 'POST', body: input, schema: zPasswordSet }),
  });
}

const zResetRequested = z.object({ message: z.string() });

/** "Forgot your password?": the server answers the same whether or not the address has an account. */
export function useForgotPasswordMutation() {
  return useMutation({
    mutationFn: (input: ForgotPasswordInput) => apiOrThrow('/api/auth/forgot-password', { method: 'POST', body: input, schema: zResetRequested }),
  });
}

const zPasswordChanged = z.object({ sessionsEnded: z.number() });

export function useChangePasswordMutation() {
  return useMutation({
    mutationFn: (input: { currentPassword: string; newPassword: string }) => apiOrThrow('/api/auth/change-password', { method: 'POST', body: input, schema: zPasswordChanged }),
  });
}
