/** The mail outbox (admin): what Fieldfile sent, newest first. */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { zOutboxMessageDto } from '../../constants/schemas/users';
import { apiOrThrow } from '../api-client';

export const outboxKeys = {
  all: ['outbox'] as const,
  list: () => [...outboxKeys.all, 'list'] as const,
  detail: (id: number) => [...outboxKeys.all, 'detail', id] as const,
};

const zMessageList = z.object({ messages: z.array(zOutboxMessageDto) });
const zMessageEnvelope = z.object({ message: zOutboxMessageDto });

export function useOutboxQuery() {
  return useQuery({
    queryKey: outboxKeys.list(),
    queryFn: ({ signal }) => apiOrThrow('/api/outbox', { schema: zMessageList, signal }).then((d) => d.messages),
  });
}

export function useOutboxMessageQuery(id: number) {
  return useQuery({
    queryKey: outboxKeys.detail(id),
    queryFn: ({ signal }) => apiOrThrow(`/api/outbox/${id}`, { schema: zMessageEnvelope, signal }).then((d) => d.message),
    enabled: Number.isInteger(id) && id > 0,
  });
}
