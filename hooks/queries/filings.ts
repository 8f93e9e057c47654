/**
 * Filings: the list, one filing with its steps, create / import, saving a wizard step, the
 * screening table and the SAR-against-depth profile. Responses are checked for the fields the
 * screens rely on; the detailed shapes are the server's own types.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { ScreeningGap, ScreeningRow, ScreeningSummary } from '../../calc/screening/screen';
import type { ModuleConditionWarning } from '../../calc/screening/module-conditions';
import type { Derivation } from '../../calc/types';
import type { DeviceFileInput } from '../../constants/schemas/device-file';
import { FILING_SORTS, VERSION_STATES, WIZARD_STEPS, type DataStep, type FilingDetail, type FilingSummary, type NewFilingInput } from '../../constants/schemas/filings';
import { apiOrThrow } from '../api-client';

export type FilingSort = (typeof FILING_SORTS)[number];

export const filingKeys = {
  all: ['filings'] as const,
  lists: () => [...filingKeys.all, 'list'] as const,
  list: (q: string, sort: FilingSort, archived = false) => [...filingKeys.lists(), { q, sort, archived }] as const,
  detail: (id: number) => [...filingKeys.all, 'detail', id] as const,
  screening: (id: number) => [...filingKeys.all, 'screening', id] as const,
  depthProfile: (id: number, transmitterId: string, usePositionId: string) => [...filingKeys.screening(id), 'depth', transmitterId, usePositionId] as const,
};

const zSummaryShape = z.looseObject({
  id: z.number(),
  device: z.looseObject({ name: z.string(), model: z.string() }),
  version: z.looseObject({ number: z.number(), state: z.enum(VERSION_STATES) }),
  markets: z.array(z.string()),
  owner: z.looseObject({ name: z.string() }),
  updatedAt: z.string(),
});
const zSummary = zSummaryShape as unknown as z.ZodType<FilingSummary>;
const zDetail = zSummaryShape.extend({
  editable: z.boolean(),
  steps: z.array(z.looseObject({ step: z.enum(WIZARD_STEPS), complete: z.boolean(), problems: z.array(z.string()), hasDraft: z.boolean() })),
  data: z.looseObject({ device: z.looseObject({}), radios: z.looseObject({}), 'use-positions': z.looseObject({}), markets: z.looseObject({}) }),
  drafts: z.record(z.string(), z.looseObject({ updatedAt: z.string() })),
  revisions: z.record(z.string(), z.string()),
}) as unknown as z.ZodType<FilingDetail>;

const zList = z.object({ filings: z.array(zSummary) });
const zEnvelope = z.object({ filing: zDetail });
const zSaved = z.object({ saved: z.literal(true), filing: zDetail });

/** A row as the API sends it; older engines also sent the rule's own derivation apart. */
export type ScreeningRowDto = ScreeningRow & { ruleDerivation?: Derivation | null };

export interface FilingScreening {
  filingId: number;
  version: number;
  rows: ScreeningRowDto[];
  gaps: ScreeningGap[];
  /** Use positions closer than a certified module's grant allows; absent from results stored by older engines. */
  conditions?: ModuleConditionWarning[];
  summary: ScreeningSummary;
  engineVersion: string;
  ruleSetVersion: string;
  computedAt: string;
  complete: boolean;
  cautions: string[];
  derivation: Derivation;
}
const zScreening = z.looseObject({
  rows: z.array(z.looseObject({ transmitterId: z.string(), usePositionId: z.string(), regime: z.string(), result: z.string(), derivation: z.looseObject({ formula: z.string() }) })),
  gaps: z.array(z.looseObject({ message: z.string() })),
  summary: z.looseObject({ total: z.looseObject({}) }),
  engineVersion: z.string(),
  ruleSetVersion: z.string(),
  cautions: z.array(z.string()),
}) as unknown as z.ZodType<FilingScreening>;

export interface DepthProfile {
  transmitterId: string;
  usePositionId: string;
  estimate: 'screening';
  usePositionKind: string;
  /** The screening row's figures the profile rests on. */
  basis: { regime: string; frequencyHz: number; eirpW: number; separationM: number };
  stackId: 'head' | 'trunk' | 'limb';
  stackTitle: string;
  stack: { name: string; tissue: string; thicknessM: number | null }[];
  distanceUsedM: number;
  wavelengthM: number;
  reactiveNearFieldBoundaryM: number;
  scale: 'absolute' | 'relative';
  scaleReason: string;
  relativeProfile: { depthM: number; relativeSar: number; layerIndex: number }[];
  /** Only beyond the reactive near field (scale 'absolute'). */
  absolute: {
    incidentPowerDensityWPerM2: number;
    sarProfile: { depthM: number; sarWPerKg: number; layerIndex: number }[];
    surfaceSarWPerKg: number;
    peakSarWPerKgByLayer: number[];
    averagedSarWPerKg: { '1g': number; '10g': number };
  } | null;
  reflectedFraction: number;
  absorbedFractionByLayer: number[];
  derivation: Derivation;
  cautions: string[];
}
const zDepthProfile = z.looseObject({
  scale: z.enum(['absolute', 'relative']),
  relativeProfile: z.array(z.object({ depthM: z.number(), relativeSar: z.number(), layerIndex: z.number() })),
  stack: z.array(z.looseObject({ name: z.string() })),
  stackTitle: z.string(),
  scaleReason: z.string(),
  absolute: z.looseObject({ sarProfile: z.array(z.object({ depthM: z.number(), sarWPerKg: z.number(), layerIndex: z.number() })) }).nullable(),
  cautions: z.array(z.string()),
}) as unknown as z.ZodType<DepthProfile>;

/** `archived`: list archived filings too (the default list hides them). */
export function useFilingsQuery(q: string, sort: FilingSort, archived = false) {
  return useQuery({
    queryKey: filingKeys.list(q, sort, archived),
    queryFn: ({ signal }) => {
      const params = new URLSearchParams({ sort });
      if (q.trim()) params.set('q', q.trim());
      if (archived) params.set('archived', '1');
      return apiOrThrow(`/api/filings?${params}`, { schema: zList, signal }).then((d) => d.filings);
    },
    placeholderData: (previous) => previous,
  });
}

export function useFilingQuery(id: number) {
  return useQuery({
    queryKey: filingKeys.detail(id),
    queryFn: ({ signal }) => apiOrThrow(`/api/filings/${id}`, { schema: zEnvelope, signal }).then((d) => d.filing),
    enabled: Number.isInteger(id) && id > 0,
  });
}

function useFilingCreated() {
  const queryClient = useQueryClient();
  return (filing: FilingDetail) => {
    queryClient.setQueryData(filingKeys.detail(filing.id), filing);
    void queryClient.invalidateQueries({ queryKey: filingKeys.lists() });
  };
}

export function useCreateFilingMutation() {
  const onCreated = useFilingCreated();
  return useMutation({
    mutationFn: (input: NewFilingInput) => apiOrThrow('/api/filings', { method: 'POST', body: input, schema: zEnvelope }).then((d) => d.filing),
    onSuccess: onCreated,
  });
}

export function useImportFilingMutation() {
  const onCreated = useFilingCreated();
  return useMutation({
    // refuseDuplicate: a file this organisation imported before is a 409 `duplicate_import` (ask first).
    mutationFn: ({ file, refuseDuplicate }: { file: DeviceFileInput | unknown; refuseDuplicate: boolean }) =>
      apiOrThrow(`/api/filings/import${refuseDuplicate ? '?duplicate=refuse' : ''}`, { method: 'POST', body: file, schema: zEnvelope }).then((d) => d.filing),
    onSuccess: onCreated,
  });
}

/** Archive or restore a filing (its owner or an admin); the list and the filing refresh. */
export function useArchiveFilingMutation(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (action: 'archive' | 'restore') => apiOrThrow(`/api/filings/${id}/${action}`, { method: 'POST', body: {}, schema: zEnvelope }).then((d) => d.filing),
    onSuccess: (filing) => {
      queryClient.setQueryData(filingKeys.detail(id), filing);
      void queryClient.invalidateQueries({ queryKey: filingKeys.lists() });
      // The timeline (review's query, under the same root) gains the archive or restore entry.
      void queryClient.invalidateQueries({ queryKey: [...filingKeys.all, 'timeline', id] });
    },
  });
}

const apiBase = () => (process.env.EXPO_PUBLIC_API_URL ?? '').replace(/\/$/, '');

/** One step's whole form; a 422 throws an ApiProblem whose `fields` are the dotted paths. */
/** Saves a step; `basedOn` is the revision the form started from (a stale one answers 409). */
export function saveStep(filingId: number, step: DataStep, body: unknown, basedOn?: string): Promise<FilingDetail> {
  const headers = basedOn ? { 'If-Match': `"${basedOn}"` } : undefined;
  return apiOrThrow(`/api/filings/${filingId}/steps/${step}`, { method: 'PUT', body, schema: zSaved, headers }).then((d) => d.filing);
}

/** What a 409 on a step save carries: the data someone else saved, and its revision. */
export const zStaleStep = z.object({ current: z.object({ data: z.unknown(), revision: z.string(), updatedAt: z.string() }) });

/** The step's save address, for the page-hide keepalive request (which cannot go through `api`). */
export const stepUrl = (filingId: number, step: DataStep) => `${apiBase()}/api/filings/${filingId}/steps/${step}`;

export function useScreeningQuery(id: number) {
  return useQuery({
    queryKey: filingKeys.screening(id),
    queryFn: ({ signal }) => apiOrThrow(`/api/filings/${id}/screening`, { schema: zScreening, signal }),
    // Screening follows the wizard's data, which this app changes: fetch afresh on each visit.
    staleTime: 0,
  });
}

export function useDepthProfileQuery(id: number, transmitterId: string | null, usePositionId: string | null) {
  return useQuery({
    queryKey: filingKeys.depthProfile(id, transmitterId ?? '', usePositionId ?? ''),
    queryFn: ({ signal }) => {
      const params = new URLSearchParams({ transmitterId: transmitterId!, usePositionId: usePositionId! });
      return apiOrThrow(`/api/filings/${id}/screening/depth-profile?${params}`, { schema: zDepthProfile, signal });
    },
    enabled: !!transmitterId && !!usePositionId,
    staleTime: 0,
    placeholderData: (previous) => previous,
  });
}

/** Where the device file downloads from (same origin under `npm start`). */
export function deviceFileUrl(id: number): string {
  return `${apiBase()}/api/filings/${id}/device.json`;
}
