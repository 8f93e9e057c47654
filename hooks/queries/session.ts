/** The signed-in user: who, in which organisation, with which roles; sign-in and sign-out. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { zSessionUser, type LoginInput, type SessionUser } from '../../constants/schemas/auth';
import type { Role } from '../../constants/schemas/roles';
import { api, apiOrThrow } from '../api-client';

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

/**
 * `signedOut`: the user left on purpose, so no "come back to" link is kept.
 * `justSignedIn`: the sign-in screen navigates on by itself (to `next`), not the layout.
 */
export interface SessionState {
  user: SessionUser | null;
  signedOut?: boolean;
  justSignedIn?: boolean;
}

const zUserEnvelope = z.object({ user: zSessionUser });

export function useSessionQuery() {
  return useQuery({
    queryKey: sessionKeys.me(),
    queryFn: async ({ signal }): Promise<SessionState> => {
      const result = await api('/api/auth/me', { schema: zUserEnvelope, signal });
      if (result.ok) return { user: result.data.user };
      if (result.problem.status === 401) return { user: null };
      throw result.problem;
    },
    staleTime: Infinity,
  });
}

/** The signed-in user; only call below the (app) layout, which guarantees one. */
export function useCurrentUser(): SessionUser {
  const { data } = useSessionQuery();
  if (!data?.user) throw new Error('useCurrentUser needs a signed-in user (use it inside the (app) group).');
  return data.user;
}

export function hasRole(user: SessionUser | null | undefined, role: Role): boolean {
  return !!user?.roles.includes(role);
}

/** `keepScreen`: signing in again over the current screen (session sheet); the same person keeps every loaded screen. */
export function useLoginMutation({ keepScreen = false }: { keepScreen?: boolean } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LoginInput) => apiOrThrow('/api/auth/login', { method: 'POST', body: input, schema: zUserEnvelope }),
    onSuccess: ({ user }) => {
      const before = queryClient.getQueryData<SessionState>(sessionKeys.me())?.user;
      if (keepScreen && before?.id === user.id) {
        queryClient.setQueryData<SessionState>(sessionKeys.me(), { user });
        return;
      }
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
      queryClient.setQueryData<SessionState>(sessionKeys.me(), { user, justSignedIn: true });
    },
  });
}

export function useLogoutMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiOrThrow('/api/auth/logout', { method: 'POST' }),
    onSuccess: () => {
      queryClient.setQueryData<SessionState>(sessionKeys.me(), { user: null, signedOut: true });
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
    },
  });
}
