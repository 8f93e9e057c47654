/**
 * Readiness, review and signing of a filing: the checklist, the review (state, threads, what the
 * signed-in person may do), the timeline, the comparison of two versions, and the actions.
 * Every action invalidates the filing, so state badges and step lists follow.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef } from 'react';
import { z } from 'zod';
import type { ReadinessChecklist } from '../../calc/readiness';
import type { ComparisonDto } from '../../constants/schemas/compare';
import type { VersionState } from '../../constants/schemas/filings';
import type { NewThreadInput, ReturnInput, ReviewDto, ReviewThreadDto, SignInput, TimelineEntryDto, VerifyDto } from '../../constants/schemas/review';
import { apiOrThrow } from '../api-client';
import { filingKeys } from './filings';
import { packageKeys } from './packages';

export const reviewKeys = {
  readiness: (id: number) => [...filingKeys.all, 'readiness', id] as const,
  review: (id: number) => [...filingKeys.all, 'review', id] as const,
  timeline: (id: number) => [...filingKeys.all, 'timeline', id] as const,
  compare: (id: number, from: number, to: number) => [...filingKeys.all, 'compare', id, from, to] as const,
};

export interface FilingReadiness extends ReadinessChecklist {
  filingId: number;
  version: number;
  state: VersionState;
  cautions: string[];
}

const zReadiness = z.looseObject({
  items: z.array(z.looseObject({ id: z.string(), status: z.string(), severity: z.string(), findings: z.array(z.looseObject({ text: z.string() })) })),
  counts: z.looseObject({ blocking: z.number(), warnings: z.number() }),
  ready: z.boolean(),
  cautions: z.array(z.string()),
}) as unknown as z.ZodType<FilingReadiness>;

const zReview = z.object({
  review: z.looseObject({ version: z.looseObject({ number: z.number(), state: z.string() }), threads: z.array(z.looseObject({ id: z.number() })), can: z.looseObject({}) }),
}) as unknown as z.ZodType<{ review: ReviewDto }>;
const zThread = z.object({ thread: z.looseObject({ id: z.number(), comments: z.array(z.looseObject({ body: z.string() })) }) }) as unknown as z.ZodType<{ thread: ReviewThreadDto }>;
const zTimeline = z.object({ entries: z.array(z.looseObject({ id: z.number(), action: z.string(), at: z.string() })) }) as unknown as z.ZodType<{ entries: TimelineEntryDto[] }>;
const zCompare = z.object({ comparison: z.looseObject({ fields: z.array(z.looseObject({ label: z.string() })), impact: z.looseObject({}) }) }) as unknown as z.ZodType<{ comparison: ComparisonDto }>;
const zVerify = z.object({ verification: z.looseObject({ matches: z.boolean(), signedSha256: z.string() }) }) as unknown as z.ZodType<{ verification: VerifyDto }>;

export function useReadinessQuery(id: number, version?: number) {
  return useQuery({
    queryKey: version === undefined ? reviewKeys.readiness(id) : [...reviewKeys.readiness(id), version],
    queryFn: ({ signal }) => apiOrThrow(`/api/filings/${id}/readiness${version === undefined ? '' : `?version=${version}`}`, { schema: zReadiness, signal }),
    enabled: Number.isInteger(id) && id > 0,
  });
}

/**
 * The checklist is computed from the filing's data, so whenever the filing is read again (a step
 * saved, lab data imported, evidence uploaded: each sets or refetches the filing), so is its
 * checklist. `filingReadAt` is the filing query's `dataUpdatedAt`; the first read needs nothing.
 */
export function useReadinessFollowsFiling(id: number, filingReadAt: number) {
  const queryClient = useQueryClient();
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    void queryClient.invalidateQueries({ queryKey: reviewKeys.readiness(id) });
  }, [queryClient, id, filingReadAt]);
}

export function useReviewQuery(id: number) {
  return useQuery({
    queryKey: reviewKeys.review(id),
    queryFn: ({ signal }) => apiOrThrow(`/api/filings/${id}/review`, { schema: zReview, signal }).then((d) => d.review),
    enabled: Number.isInteger(id) && id > 0,
  });
}

export function useTimelineQuery(id: number) {
  return useQuery({
    queryKey: reviewKeys.timeline(id),
    queryFn: ({ signal }) => apiOrThrow(`/api/filings/${id}/timeline`, { schema: zTimeline, signal }).then((d) => d.entries),
    enabled: Number.isInteger(id) && id > 0,
  });
}

export function useCompareQuery(id: number, from: number, to: number) {
  return useQuery({
    queryKey: reviewKeys.compare(id, from, to),
    queryFn: ({ signal }) => apiOrThrow(`/api/filings/${id}/compare?from=${from}&to=${to}`, { schema: zCompare, signal }).then((d) => d.comparison),
    enabled: Number.isInteger(id) && id > 0 && from > 0 && to > 0,
  });
}

/**
 * After any review action: the filing, its checklist, review and timeline are read again, and so
 * is its package's status (signing turns a DRAFT preview into the signed package).
 */
function useInvalidateFiling(id: number) {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: filingKeys.all });
    void queryClient.invalidateQueries({ queryKey: [...packageKeys.all, 'status', id] });
  };
}

function useReviewAction<I>(id: number, path: string) {
  const invalidate = useInvalidateFiling(id);
  return useMutation({
    mutationFn: (body: I) => apiOrThrow(`/api/filings/${id}/review/${path}`, { method: 'POST', body: body ?? {}, schema: zReview }).then((d) => d.review),
    onSuccess: invalidate,
  });
}

export const useRequestReviewMutation = (id: number) => useReviewAction<void>(id, 'request');
export const useReturnMutation = (id: number) => useReviewAction<ReturnInput>(id, 'return');
export const useSignMutation = (id: number) => useReviewAction<SignInput>(id, 'sign');

export function useAddThreadMutation(id: number) {
  const invalidate = useInvalidateFiling(id);
  return useMutation({
    mutationFn: (body: NewThreadInput) => apiOrThrow(`/api/filings/${id}/review/threads`, { method: 'POST', body, schema: zThread }).then((d) => d.thread),
    onSuccess: invalidate,
  });
}

export function useReplyMutation(id: number) {
  const invalidate = useInvalidateFiling(id);
  return useMutation({
    mutationFn: ({ threadId, body }: { threadId: number; body: string }) =>
      apiOrThrow(`/api/filings/${id}/review/threads/${threadId}/replies`, { method: 'POST', body: { body }, schema: zThread }).then((d) => d.thread),
    onSuccess: invalidate,
  });
}

export function useResolveMutation(id: number) {
  const invalidate = useInvalidateFiling(id);
  return useMutation({
    mutationFn: ({ threadId, resolved }: { threadId: number; resolved: boolean }) =>
      apiOrThrow(`/api/filings/${id}/review/threads/${threadId}/${resolved ? 'resolve' : 'reopen'}`, { method: 'POST', body: {}, schema: zThread }).then((d) => d.thread),
    onSuccess: invalidate,
  });
}

export function useStartNextVersionMutation(id: number) {
  const invalidate = useInvalidateFiling(id);
  return useMutation({
    mutationFn: () => apiOrThrow(`/api/filings/${id}/versions`, { method: 'POST', body: {}, schema: z.object({ version: z.number() }) }).then((d) => d.version),
    onSuccess: invalidate,
  });
}

export function useVerifyMutation(id: number) {
  const invalidate = useInvalidateFiling(id);
  return useMutation({
    mutationFn: (version: number) => apiOrThrow(`/api/filings/${id}/versions/${version}/verify`, { method: 'POST', body: {}, schema: zVerify }).then((d) => d.verification),
    onSuccess: invalidate,
  });
}
