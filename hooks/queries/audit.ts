/** The organisation's audit trail (admin), newest first, filtered by filing, person and kind. */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { AUDIT_KINDS, type AuditKind } from '../../constants/schemas/audit';
import { apiOrThrow } from '../api-client';

export interface AuditFilters {
  filing?: number;
  person?: number;
  kind?: AuditKind;
}

export const auditKeys = {
  all: ['audit'] as const,
  list: (filters: AuditFilters = {}) => [...auditKeys.all, 'list', filters.filing ?? null, filters.person ?? null, filters.kind ?? null] as const,
};

export const zAuditEntry = z.object({
  id: z.number(),
  at: z.string(),
  action: z.string(),
  actorName: z.string().nullable(),
  targetType: z.string().nullable(),
  targetId: z.union([z.number(), z.string()]).nullable(),
  details: z.unknown(),
  kind: z.enum(AUDIT_KINDS).nullable().optional(),
  filingId: z.number().nullable().optional(),
});
export type AuditEntry = z.infer<typeof zAuditEntry>;

const zAuditList = z.object({ entries: z.array(zAuditEntry), more: z.boolean().optional() });
export type AuditList = z.infer<typeof zAuditList>;

export function useAuditQuery(filters: AuditFilters = {}) {
  return useQuery({
    queryKey: auditKeys.list(filters),
    queryFn: ({ signal }) => {
      const params = new URLSearchParams();
      if (filters.filing) params.set('filing', String(filters.filing));
      if (filters.person) params.set('person', String(filters.person));
      if (filters.kind) params.set('kind', filters.kind);
      const query = params.toString() ? `?${params}` : '';
      return apiOrThrow(`/api/audit${query}`, { schema: zAuditList, signal });
    },
    placeholderData: (previous) => previous,
  });
}
