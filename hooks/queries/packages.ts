/**
 * Submission packages: a version's package status, starting a build, following its progress
 * (Server-Sent Events on the web, polling elsewhere), the download link, and verification of a
 * zip or a SHA-256.
 */
import { useEffect, useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api, apiOrThrow, ApiProblem } from '../api-client';

const API_BASE = (process.env.EXPO_PUBLIC_API_URL ?? '').replace(/\/$/, '');

export const zJobStatus = z.object({
  id: z.number(),
  kind: z.string(),
  state: z.enum(['queued', 'running', 'done', 'failed']),
  stage: z.string(),
  percent: z.number(),
  error: z.string().nullable(),
  finishedAt: z.string().nullable(),
});
export type JobStatusDto = z.infer<typeof zJobStatus>;

const zPackageInfo = z.object({ kind: z.enum(['signed', 'preview']), fileName: z.string(), sizeBytes: z.number(), sha256: z.string(), builtAt: z.string() });
export const zPackageStatus = z.object({
  filingId: z.number(),
  versionNumber: z.number(),
  kind: z.enum(['signed', 'preview']),
  package: zPackageInfo.nullable(),
  upToDate: z.boolean(),
  job: zJobStatus.nullable(),
  canDownload: z.boolean(),
  canBuild: z.boolean(),
});
export type PackageStatusDto = z.infer<typeof zPackageStatus>;

export const zVerifyResult = z.object({
  verdict: z.enum(['intact', 'differs', 'unknown']),
  signed: z.boolean(),
  message: z.string(),
  sha256: z.string(),
  package: z.object({ filingId: z.number(), versionNumber: z.number(), device: z.string(), kind: z.enum(['signed', 'preview']), fileName: z.string() }).nullable(),
  files: z.array(z.object({ path: z.string(), status: z.enum(['ok', 'changed', 'missing', 'not-in-manifest']) })),
});
export type VerifyResultDto = z.infer<typeof zVerifyResult>;

export const packageKeys = {
  all: ['packages'] as const,
  status: (filingId: number, n: number) => [...packageKeys.all, 'status', filingId, n] as const,
};

const base = (filingId: number, n: number) => `/api/filings/${filingId}/versions/${n}/package`;
export const packageDownloadUrl = (filingId: number, n: number) => `${API_BASE}${base(filingId, n)}`;

export function usePackageStatusQuery(filingId: number, n: number) {
  return useQuery({
    queryKey: packageKeys.status(filingId, n),
    queryFn: ({ signal }) => apiOrThrow(`${base(filingId, n)}/status`, { schema: zPackageStatus, signal }),
  });
}

export function useBuildPackageMutation(filingId: number, n: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiOrThrow(base(filingId, n), { method: 'POST', schema: z.object({ job: zJobStatus }) }).then((d) => d.job),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: packageKeys.status(filingId, n) }),
  });
}

const POLL_MS = 1000;
const finished = (s: JobStatusDto) => s.state === 'done' || s.state === 'failed';

/**
 * The live status of a job until it ends: Server-Sent Events where EventSource exists (the web),
 * otherwise polling the package status. Calls `onEnd` once when it is done or failed.
 */
export function useJobProgress(job: JobStatusDto | null | undefined, filingId: number, n: number, onEnd: () => void): JobStatusDto | null {
  const [live, setLive] = useState<JobStatusDto | null>(null);
  const id = job && !finished(job) ? job.id : null;
  useEffect(() => {
    setLive(null);
    if (id === null) return;
    let ended = false;
    const end = () => {
      if (!ended) {
        ended = true;
        onEnd();
      }
    };
    if (typeof EventSource !== 'undefined') {
      const source = new EventSource(`${API_BASE}/api/jobs/${id}/events`, { withCredentials: true });
      source.addEventListener('progress', (e) => {
        const parsed = zJobStatus.safeParse(JSON.parse((e as MessageEvent).data));
        if (!parsed.success) return;
        setLive(parsed.data);
        if (finished(parsed.data)) {
          source.close();
          end();
        }
      });
      source.onerror = () => {
        source.close();
        end();
      };
      return () => source.close();
    }
    const timer = setInterval(async () => {
      const res = await api(`${base(filingId, n)}/status`, { schema: zPackageStatus });
      if (!res.ok || !res.data.job) return;
      setLive(res.data.job);
      if (finished(res.data.job)) {
        clearInterval(timer);
        end();
      }
    }, POLL_MS);
    return () => clearInterval(timer);
    // onEnd is a fresh closure each render; the subscription follows the job id only.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [id, filingId, n]);
  return live ?? job ?? null;
}

export function useVerifyHashMutation() {
  return useMutation({
    mutationFn: (sha256: string) => apiOrThrow('/api/packages/verify', { method: 'POST', body: { sha256 }, schema: zVerifyResult }),
  });
}

/** Uploads a zip (a web File/Blob) for verification. */
export function useVerifyZipMutation() {
  return useMutation({
    mutationFn: async (file: Blob & { name?: string }) => {
      const form = new FormData();
      form.append('file', file, file.name ?? 'package.zip');
      const response = await fetch(`${API_BASE}/api/packages/verify`, { method: 'POST', body: form, credentials: 'include', headers: { Accept: 'application/json' } });
      const body = await response.json().catch(() => null);
      if (!response.ok)
        throw new ApiProblem({ status: response.status, code: body?.error?.code ?? 'error', message: body?.error?.message ?? 'The zip could not be checked.', fields: body?.error?.fields });
      return zVerifyResult.parse(body);
    },
  });
}
