/**
 * Evidence of a filing: the list (records, history, required categories, read-back findings),
 * uploads with progress (XMLHttpRequest: fetch reports no upload progress), removal, and
 * explaining a finding. Each change invalidates the list and the filing (its step list).
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { EvidenceList, UploadedEvidence } from '../../constants/schemas/evidence';
import { ApiProblem, apiOrThrow, apiUrl } from '../api-client';
import { filingKeys } from './filings';

export const evidenceKeys = {
  list: (filingId: number) => [...filingKeys.detail(filingId), 'evidence'] as const,
};

const zList = z.looseObject({
  filingId: z.number(),
  editable: z.boolean(),
  records: z.array(z.looseObject({ id: z.number(), category: z.string(), sha256: z.string() })),
  history: z.array(z.looseObject({ id: z.number() })),
  required: z.array(z.looseObject({ category: z.string(), present: z.boolean() })),
  findings: z.array(z.looseObject({ key: z.string(), evidenceId: z.number(), message: z.string() })),
}) as unknown as z.ZodType<EvidenceList>;

export function useEvidenceQuery(filingId: number) {
  return useQuery({ queryKey: evidenceKeys.list(filingId), queryFn: ({ signal }) => apiOrThrow(`/api/filings/${filingId}/evidence`, { schema: zList, signal }) });
}

export const evidenceFileUrl = (filingId: number, evidenceId: number) => apiUrl(`/api/filings/${filingId}/evidence/${evidenceId}/file`);

export interface UploadRequest {
  /** A web File/Blob, or on native { uri, name, type }. */
  file: Blob | { uri: string; name: string; type: string };
  fileName: string;
  category: string;
  title?: string;
  note?: string;
  documentDate?: string;
}

/** Uploads one file; `onProgress` gets 0…1 as the bytes leave. Rejects with an ApiProblem. */
export function uploadEvidence(filingId: number, req: UploadRequest, onProgress: (fraction: number) => void): Promise<UploadedEvidence> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append('category', req.category);
    if (req.title) form.append('title', req.title);
    if (req.note) form.append('note', req.note);
    if (req.documentDate) form.append('documentDate', req.documentDate);
    form.append('file', req.file as Blob, req.fileName);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', apiUrl(`/api/filings/${filingId}/evidence`));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiProblem({ status: 0, code: 'network', message: 'The upload did not reach Fieldfile’s server. Check your connection and try again.' }));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = undefined;
      }
      if (xhr.status === 201) return resolve(body as UploadedEvidence);
      const error = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | undefined)?.error;
      reject(new ApiProblem({ status: xhr.status, code: error?.code ?? 'http_error', message: error?.message ?? `The server answered ${xhr.status}.`, fields: error?.fields }));
    };
    xhr.send(form);
  });
}

/** Call after uploads finish: the list and the filing's step list change. */
export function useRefreshEvidence(filingId: number) {
  const client = useQueryClient();
  return () => client.invalidateQueries({ queryKey: filingKeys.detail(filingId) });
}

export function useRemoveEvidenceMutation(filingId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (evidenceId: number) => apiOrThrow(`/api/filings/${filingId}/evidence/${evidenceId}`, { method: 'DELETE' }),
    onSuccess: () => client.invalidateQueries({ queryKey: filingKeys.detail(filingId) }),
  });
}

export function useExplainFindingMutation(filingId: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (v: { evidenceId: number; key: string; reason: string }) =>
      apiOrThrow(`/api/filings/${filingId}/evidence/${v.evidenceId}/findings/explain`, { method: 'POST', body: { key: v.key, reason: v.reason }, schema: zList }),
    onSuccess: (data) => {
      client.setQueryData(evidenceKeys.list(filingId), data);
      return client.invalidateQueries({ queryKey: filingKeys.detail(filingId) });
    },
  });
}
