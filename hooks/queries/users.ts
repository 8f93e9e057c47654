/** The organisation's people (admin): list, invite, change roles, deactivate or reactivate. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { zUserDto, type CreateUserInput, type UpdateUserInput } from '../../constants/schemas/users';
import { apiOrThrow } from '../api-client';
import { auditKeys } from './audit';
import { outboxKeys } from './outbox';

export const userKeys = {
  all: ['users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};

const zUserList = z.object({ users: z.array(zUserDto) });
const zUserEnvelope = z.object({ user: zUserDto });
const zInvited = z.object({
  user: zUserDto,
  invitation: z.object({ sent: z.boolean(), error: z.string().optional() }),
});
export type InviteResult = z.infer<typeof zInvited>;

export function useUsersQuery() {
  return useQuery({
    queryKey: userKeys.list(),
    queryFn: ({ signal }) => apiOrThrow('/api/users', { schema: zUserList, signal }).then((d) => d.users),
  });
}

export function useInviteUserMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateUserInput) => apiOrThrow('/api/users', { method: 'POST', body: input, schema: zInvited }),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
      void queryClient.invalidateQueries({ queryKey: outboxKeys.all });
      void queryClient.invalidateQueries({ queryKey: auditKeys.all });
    },
  });
}

export function useUpdateUserMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, changes }: { id: number; changes: UpdateUserInput }) => apiOrThrow(`/api/users/${id}`, { method: 'PATCH', body: changes, schema: zUserEnvelope }).then((d) => d.user),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
      void queryClient.invalidateQueries({ queryKey: auditKeys.all });
    },
  });
}

/** A fresh invitation link for someone who has not joined yet (the old link stops working). */
export function useResendInvitationMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiOrThrow(`/api/users/${id}/invitation`, { method: 'POST', body: {}, schema: zInvited }),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
      void queryClient.invalidateQueries({ queryKey: outboxKeys.all });
      void queryClient.invalidateQueries({ queryKey: auditKeys.all });
    },
  });
}
