/** The organisation's audit trail (admin), newest first. */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiOrThrow } from '../api-client';

export const auditKeys = {
  all: ['audit'] as const,
  list: () => [...auditKeys.all, 'list'] as const,
};

export const zAuditEntry = z.object({
  id: z.number(),
  at: z.string(),
  action: z.string(),
  actorName: z.string().nullable(),
  targetType: z.string().nullable(),
  targetId: z.union([z.number(), z.string()]).nullable(),
  details: z.unknown(),
});
export type AuditEntry = z.infer<typeof zAuditEntry>;

const zAuditList = z.object({ entries: z.array(zAuditEntry) });

export function useAuditQuery() {
  return useQuery({
    queryKey: auditKeys.list(),
    queryFn: ({ signal }) => apiOrThrow('/api/audit', { schema: zAuditList, signal }).then((d) => d.entries),
  });
}
