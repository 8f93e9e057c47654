/** Invitation links: who a set-password link is for, and setting the password. */
import { useMutation, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiOrThrow } from '../api-client';

export const passwordTokenKeys = {
  all: ['password-token'] as const,
  detail: (token: string) => [...passwordTokenKeys.all, token] as const,
};

const zTokenOwner = z.object({
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
    mutationFn: (input: { token: string; password: string }) =>
      apiOrThrow('/api/auth/set-password', { method: 'POST', body: input, schema: zPasswordSet }),
  });
}

export function useAcceptInvitationMutation() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) =>
      apiOrThrow('/api/auth/accept-invitation', { method: 'POST', body: input, schema: zPasswordSet }),
  });
}
