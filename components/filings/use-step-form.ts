/**
 * One wizard step's form: starts from the server's draft when there is one (so a reload loses
 * nothing), validates with the step's shared schema, and autosaves.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { useForm, type FieldValues, type Path, type PathValue, type Resolver, type UseFormReturn } from 'react-hook-form';
import { STEP_SCHEMAS, type DataStep, type FilingDetail } from '../../constants/schemas/filings';
import { useAutosave, type AutosaveStatus } from '../../hooks/use-autosave';

export function useStepForm<T extends FieldValues>(filing: FilingDetail, step: DataStep, fromDraft: (raw: unknown, saved: T) => T) {
  const draft = filing.drafts[step];
  const [initial] = useState<T>(() => {
    const saved = filing.data[step] as unknown as T;
    return draft ? fromDraft(draft.data, saved) : saved;
  });
  const form = useForm<T>({
    resolver: zodResolver(STEP_SCHEMAS[step] as never) as unknown as Resolver<T>,
    defaultValues: initial as never,
    mode: 'onChange',
  });
  const [initialStatus] = useState<AutosaveStatus>(() => (draft ? { kind: 'invalid', at: new Date(draft.updatedAt), problems: 0 } : { kind: 'idle' }));
  const [revision] = useState(() => filing.revisions?.[step]);
  const autosave = useAutosave({ form, filingId: filing.id, step, enabled: filing.editable, initialStatus, revision });
  useEffect(() => {
    // A draft is kept because it had errors: show them at once.
    if (draft && filing.editable) void form.trigger();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  return { form, autosave, draft: draft ?? null, editable: filing.editable };
}
export type StepForm<T extends FieldValues> = ReturnType<typeof useStepForm<T>>;

/** Draft data is whatever was sent last; keep it only when it has the step's outer shape. */
export const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
export const arrayOf = (v: unknown): Record<string, unknown>[] => (Array.isArray(v) ? v.filter(isObject) : []);

/**
 * A row added in the form learns its saved row number once the step has saved (matched by label),
 * so that a later rename in the same visit keeps the row and what refers to it.
 */
export function useAdoptRowIds<T extends FieldValues>(form: UseFormReturn<T>, name: Path<T>, stored: readonly { rowId?: number; id: string }[]) {
  useEffect(() => {
    const rows = (form.getValues(name) ?? []) as ({ rowId?: number; id: string } | undefined)[];
    const used = new Set(rows.map((r) => r?.rowId).filter(Boolean));
    rows.forEach((r, i) => {
      if (!r || r.rowId) return;
      const match = stored.find((x) => x.id === r.id && x.rowId && !used.has(x.rowId));
      if (!match?.rowId) return;
      used.add(match.rowId);
      form.setValue(`${name}.${i}.rowId` as Path<T>, match.rowId as PathValue<T, Path<T>>);
    });
  }, [form, name, stored]);
}
