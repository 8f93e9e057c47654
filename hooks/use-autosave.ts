/**
 * Autosave for a wizard step: every change (debounced) sends the whole step form. A valid step
 * is saved; an invalid one is kept on the server as a draft and its field messages land on their
 * fields (the server's dotted paths are the form's field names). A pending change is sent when
 * the step is left. Each save names the revision it started from; when someone else saved the
 * step meanwhile the server refuses it (409) and the person chooses: load theirs or keep mine.
 * One save is in flight at a time, so a person's own saves never look stale to each other.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { FieldPath, FieldValues, UseFormReturn } from 'react-hook-form';
import { Platform } from 'react-native';
import type { DataStep } from '../constants/schemas/filings';
import { asProblem } from './api-client';
import { whenBackOnline, whenSignedInAgain } from './connection-recovery';
import { stepDifferences } from '../components/filings/step-differences';
import { filingKeys, saveStep, stepUrl, zStaleStep } from './queries/filings';

export const AUTOSAVE_DELAY_MS = 800;

export type AutosaveStatus =
  | { kind: 'idle' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  | { kind: 'saved'; at: Date }
  | { kind: 'invalid'; at: Date; problems: number }
  | { kind: 'failed'; message: string }
  /** Not sent yet for a passing reason; kept, and sent by itself when it passes. */
  | { kind: 'waiting'; reason: 'signed-out' | 'offline' }
  /** Someone else saved this step since it was opened; nothing of this person's was saved. */
  | { kind: 'conflict'; theirs: unknown; revision: string; changed: string[]; at: Date };

export function useAutosave<T extends FieldValues>({
  form,
  filingId,
  step,
  enabled,
  revision,
  toBody = (v) => v,
  delayMs = AUTOSAVE_DELAY_MS,
  initialStatus = { kind: 'idle' },
}: {
  form: UseFormReturn<T>;
  filingId: number;
  step: DataStep;
  enabled: boolean;
  /** The stored step's revision the form started from (sent as If-Match). */
  revision?: string;
  /** The request body for the form's values (most steps send them as they are). */
  toBody?: (values: T) => unknown;
  delayMs?: number;
  /** E.g. "invalid" when the form starts from a draft that had errors. */
  initialStatus?: AutosaveStatus;
}) {
  const queryClient = useQueryClient();
  const [status, setStatus] = useState<AutosaveStatus>(initialStatus);
  const lastSent = useRef(JSON.stringify(toBody(form.getValues())));
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const mounted = useRef(true);
  const cancelResend = useRef<(() => void) | null>(null);
  const toBodyRef = useRef(toBody);
  toBodyRef.current = toBody;
  const basedOn = useRef(revision);
  const inFlight = useRef<Promise<void> | null>(null);
  const conflicted = useRef(false);

  const save = useCallback(async (): Promise<void> => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    // While a conflict waits for the person's choice, nothing is sent.
    if (conflicted.current) return;
    if (inFlight.current) {
      // Wait for the save on its way, then send what the form holds by then.
      await inFlight.current;
      return save();
    }
    const run = send();
    inFlight.current = run;
    try {
      await run;
    } finally {
      inFlight.current = null;
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [filingId, step, form, queryClient]);

  const send = async () => {
    const body = toBodyRef.current(form.getValues());
    const json = JSON.stringify(body);
    if (json === lastSent.current) {
      if (mounted.current) setStatus((s) => (s.kind === 'pending' ? { kind: 'idle' } : s));
      return;
    }
    lastSent.current = json;
    if (mounted.current) setStatus({ kind: 'saving' });
    try {
      const filing = await saveStep(filingId, step, body, basedOn.current);
      basedOn.current = filing.revisions?.[step] ?? basedOn.current;
      queryClient.setQueryData(filingKeys.detail(filingId), filing);
      void queryClient.invalidateQueries({ queryKey: filingKeys.lists() });
      void queryClient.invalidateQueries({ queryKey: filingKeys.screening(filingId) });
      // Only the newest request's answer may change what the form shows.
      if (!mounted.current || lastSent.current !== json) return;
      form.clearErrors();
      setStatus({ kind: 'saved', at: new Date() });
    } catch (error) {
      const problem = asProblem(error);
      void queryClient.invalidateQueries({ queryKey: filingKeys.detail(filingId) });
      if (problem.status === 409 && problem.code === 'stale_step') {
        const stale = zStaleStep.safeParse(problem.body);
        if (stale.success) {
          conflicted.current = true;
          lastSent.current = '';
          const { data, revision: theirs } = stale.data.current;
          if (mounted.current) setStatus({ kind: 'conflict', theirs: data, revision: theirs, changed: stepDifferences(body, data), at: new Date() });
          return;
        }
      }
      if (!mounted.current || lastSent.current !== json) return;
      if (problem.status === 422 && problem.fields) {
        form.clearErrors();
        const entries = Object.entries(problem.fields);
        for (const [path, message] of entries) {
          form.setError((path === '_' ? 'root.server' : path) as FieldPath<T>, { type: 'server', message });
        }
        setStatus({ kind: 'invalid', at: new Date(), problems: entries.length });
      } else if (problem.status === 401 || problem.status === 0) {
        // Session ended or offline: keep the change and send it again by itself.
        lastSent.current = '';
        setStatus({ kind: 'waiting', reason: problem.status === 401 ? 'signed-out' : 'offline' });
        cancelResend.current?.();
        const resend = () => void save();
        cancelResend.current = problem.status === 401 ? whenSignedInAgain(resend) : whenBackOnline(resend);
      } else {
        // Nothing was stored: let the next change (or "Try again") send it again.
        lastSent.current = '';
        setStatus({ kind: 'failed', message: problem.message });
      }
    }
  };

  /** After a conflict: take the other person's step, or send mine over it on purpose. */
  const resolveConflict = useCallback(
    (choice: 'theirs' | 'mine') => {
      if (status.kind !== 'conflict') return;
      basedOn.current = status.revision;
      conflicted.current = false;
      if (choice === 'theirs') {
        form.reset(status.theirs as T);
        lastSent.current = JSON.stringify(toBodyRef.current(form.getValues()));
        form.clearErrors();
        setStatus({ kind: 'idle' });
        void queryClient.invalidateQueries({ queryKey: filingKeys.detail(filingId) });
        return;
      }
      void save();
    },
    [status, form, save, queryClient, filingId],
  );

  useEffect(() => {
    mounted.current = true;
    if (!enabled) return;
    const sub = form.watch(() => {
      if (timer.current) clearTimeout(timer.current);
      // A conflict stays on screen until the person chooses; their edits are kept meanwhile.
      if (conflicted.current) return;
      setStatus({ kind: 'pending' });
      timer.current = setTimeout(() => void save(), delayMs);
    });
    // Web: a reload or a closed tab while a change waits still sends it (keepalive outlives the page).
    const onPageHide = () => {
      if (!timer.current) return;
      clearTimeout(timer.current);
      timer.current = null;
      const body = JSON.stringify(toBodyRef.current(form.getValues()));
      if (body === lastSent.current) return;
      lastSent.current = body;
      if (conflicted.current) return;
      const ifMatch: Record<string, string> = basedOn.current ? { 'If-Match': `"${basedOn.current}"` } : {};
      void fetch(stepUrl(filingId, step), {
        method: 'PUT',
        body,
        keepalive: true,
        credentials: 'include',
        headers: { 'Content-Type': 'application/json', Accept: 'application/json', ...ifMatch },
      }).catch(() => undefined);
    };
    const web = Platform.OS === 'web' && typeof window !== 'undefined';
    if (web) window.addEventListener('pagehide', onPageHide);
    return () => {
      if (web) window.removeEventListener('pagehide', onPageHide);
      sub.unsubscribe();
      mounted.current = false;
      cancelResend.current?.();
      // Leaving the step sends what is still waiting.
      if (timer.current) void save();
    };
  }, [enabled, form, save, delayMs, filingId, step]);

  return { status, saveNow: save, resolveConflict };
}
