/**
 * Lab results: the computed results table (reported SAR, highest per condition, checks,
 * co-transmission) and the measurement spreadsheet import (dry run, then all or nothing), with
 * upload progress for large files.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { LabResults } from '../../calc/lab/lab-results';
import type { CoTransmissionDto, CoTransmissionGroup } from '../../constants/schemas/co-transmission';
import { LAB_SETS, type ImportMapping, type ImportPreview, type LabData, type LabSet } from '../../constants/schemas/lab';
import { ApiProblem, apiOrThrow } from '../api-client';
import { filingKeys } from './filings';

export type { ImportPreview };

export const labKeys = {
  all: (id: number) => [...filingKeys.all, 'lab', id] as const,
  results: (id: number) => [...labKeys.all(id), 'results'] as const,
};

/** The lab results as the API sends them: the engine's output and the versions it was computed with. */
export type FilingLabResults = Omit<LabResults, 'derivation'> & {
  filingId: number;
  version: number;
  engineVersion: string;
  ruleSetVersion: string;
  computedAt: string;
  cautions: string[];
};
const zLabResults = z.looseObject({
  rows: z.array(z.looseObject({ measurementId: z.string(), flags: z.array(z.looseObject({ status: z.string() })), derivation: z.looseObject({ formula: z.string() }) })),
  highest: z.array(z.looseObject({ regime: z.string(), usePositionKind: z.string() })),
  coTransmission: z.array(z.looseObject({ outcome: z.string() })),
  checks: z.array(z.looseObject({ id: z.string(), status: z.string(), howToFix: z.string() })),
  cautions: z.array(z.string()),
  engineVersion: z.string(),
}) as unknown as z.ZodType<FilingLabResults>;

export function useLabResultsQuery(id: number) {
  return useQuery({
    queryKey: labKeys.results(id),
    queryFn: ({ signal }) => apiOrThrow(`/api/filings/${id}/lab-results`, { schema: zLabResults, signal }),
    staleTime: 0,
  });
}

/** A refused import still carries its preview (every problem by line and column). */
export class ImportProblemError extends ApiProblem {
  constructor(
    status: number,
    message: string,
    readonly preview: ImportPreview | null,
  ) {
    super({ status, code: status === 422 ? 'invalid_input' : 'import_failed', message });
  }
}

const apiBase = () => (process.env.EXPO_PUBLIC_API_URL ?? '').replace(/\/$/, '');

export interface UploadArgs {
  filingId: number;
  file: Blob;
  fileName: string;
  dryRun: boolean;
  mapping?: ImportMapping;
  onProgress?: (fraction: number) => void;
}

/** Multipart upload through XMLHttpRequest, which reports upload progress (fetch does not). */
export function uploadMeasurements({ filingId, file, fileName, dryRun, mapping, onProgress }: UploadArgs): Promise<ImportPreview> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append('dryRun', String(dryRun));
    if (mapping) form.append('mapping', JSON.stringify(mapping));
    form.append('file', file, fileName);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `${apiBase()}/api/filings/${filingId}/measurements/import`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiProblem({ status: 0, code: 'network', message: 'Fieldfile’s server could not be reached. Check your connection and try again.' }));
    xhr.onload = () => {
      let body: { import?: ImportPreview; error?: { message?: string } } = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status >= 200 && xhr.status < 300 && body.import) return resolve(body.import);
      reject(new ImportProblemError(xhr.status, body.error?.message ?? `The server answered ${xhr.status}.`, body.import ?? null));
    };
    xhr.send(form);
  });
}

export function useImportMeasurementsMutation(filingId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (args: Omit<UploadArgs, 'filingId'>) => uploadMeasurements({ ...args, filingId }),
    onSuccess: (preview) => {
      if (preview.dryRun) return;
      void queryClient.invalidateQueries({ queryKey: labKeys.all(filingId) });
      void queryClient.invalidateQueries({ queryKey: filingKeys.detail(filingId) });
    },
  });
}

// ---------------------------------------------------------------------------------------------
// The engineer's tables (entered by hand) and the specialist's co-transmission groups: read with
// their revision, replaced whole with If-Match (409 with the current rows when someone saved since).

export type LabSetRows = { [S in LabSet]: LabData[(typeof LAB_SETS)[S]['key']] };
export interface LabSetDto<S extends LabSet> {
  version: number;
  rows: LabSetRows[S];
  revision: string;
}

export const labSetKey = (id: number, set: LabSet) => [...labKeys.all(id), 'set', set] as const;
const zSetAnswer = z.looseObject({ version: z.number(), revision: z.string() });

export function useLabSetQuery<S extends LabSet>(id: number, set: S) {
  return useQuery({
    queryKey: labSetKey(id, set),
    queryFn: async ({ signal }): Promise<LabSetDto<S>> => {
      const body = (await apiOrThrow(`/api/filings/${id}/${set}`, { schema: zSetAnswer, signal })) as Record<string, unknown> & { version: number; revision: string };
      return { version: body.version, revision: body.revision, rows: body[LAB_SETS[set].key] as LabSetRows[S] };
    },
  });
}

/** Replaces one table; resolves with the stored rows and their new revision. */
export async function saveLabSet<S extends LabSet>(id: number, set: S, rows: LabSetRows[S], revision: string | undefined): Promise<{ rows: LabSetRows[S]; revision: string }> {
  const body = (await apiOrThrow(`/api/filings/${id}/${set}`, {
    method: 'PUT',
    body: { [LAB_SETS[set].key]: rows },
    headers: revision ? { 'If-Match': `"${revision}"` } : {},
    schema: zSetAnswer,
  })) as Record<string, unknown> & { revision: string };
  return { rows: body[LAB_SETS[set].key] as LabSetRows[S], revision: body.revision };
}

/** The rows and revision a 409 carries (someone saved the table since it was opened). */
export function staleLabSet<S extends LabSet>(set: S, problemBody: unknown): { rows: LabSetRows[S]; revision: string } | null {
  const current = (problemBody as { current?: Record<string, unknown> } | undefined)?.current;
  if (!current || typeof current.revision !== 'string' || !Array.isArray(current[LAB_SETS[set].key])) return null;
  return { rows: current[LAB_SETS[set].key] as LabSetRows[S], revision: current.revision };
}

export const coTransmissionKey = (id: number) => [...labKeys.all(id), 'co-transmission'] as const;
const zCoTransmissionAnswer = z.object({
  version: z.number(),
  revision: z.string(),
  groups: z.array(z.object({ usePositionId: z.string().nullable(), transmitterIds: z.array(z.string()) })),
});

export function useCoTransmissionQuery(id: number) {
  return useQuery({
    queryKey: coTransmissionKey(id),
    queryFn: ({ signal }): Promise<CoTransmissionDto> => apiOrThrow(`/api/filings/${id}/co-transmission`, { schema: zCoTransmissionAnswer, signal }),
  });
}

export async function saveCoTransmission(id: number, groups: CoTransmissionGroup[], revision: string | undefined): Promise<{ rows: CoTransmissionGroup[]; revision: string }> {
  const body = await apiOrThrow(`/api/filings/${id}/co-transmission`, {
    method: 'PUT',
    body: { groups },
    headers: revision ? { 'If-Match': `"${revision}"` } : {},
    schema: zCoTransmissionAnswer,
  });
  return { rows: body.groups, revision: body.revision };
}

export function staleCoTransmission(problemBody: unknown): { rows: CoTransmissionGroup[]; revision: string } | null {
  const parsed = z.object({ current: z.object({ groups: zCoTransmissionAnswer.shape.groups, revision: z.string() }) }).safeParse(problemBody);
  return parsed.success ? { rows: parsed.data.current.groups, revision: parsed.data.current.revision } : null;
}
