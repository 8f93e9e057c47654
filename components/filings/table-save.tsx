/**
 * Saving a whole table with an explicit Save (lab tables, co-transmission groups): the server
 * replaces the table in one transaction and recomputes the lab results, so a half-typed row is
 * never sent. The form is validated with its shared schema first; the server's 422 field messages
 * land on their fields (its dotted paths are the form's names) and its message shows by the
 * button; a save based on an older revision (409) offers the other person's table or mine.
 */
import { useCallback, useEffect, useRef, useState } from 'react';
import type { FieldPath, FieldValues, UseFormReturn } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { SavingNote } from './save-indicator';

export type TableSaveStatus =
  { kind: 'idle' } | { kind: 'saving' } | { kind: 'saved'; at: Date } | { kind: 'invalid'; problems: number; message: string } | { kind: 'failed'; message: string } | { kind: 'conflict'; at: Date };

interface Saved<R> {
  rows: R;
  revision: string;
}

/**
 * `toValues`/`fromValues` convert between the stored rows and the form's values; `send` saves
 * (If-Match: the revision) and `stale` reads the current rows out of a 409's body.
 */
export function useTableSave<T extends FieldValues, R>({
  form,
  rows,
  revision,
  send,
  stale,
  toValues,
  fromValues,
  onSaved,
}: {
  form: UseFormReturn<T>;
  /** The stored rows as last read, and their revision. */
  rows: R;
  revision: string | undefined;
  send: (rows: R, revision: string | undefined) => Promise<Saved<R>>;
  stale: (body: unknown) => Saved<R> | null;
  toValues: (rows: R) => T;
  fromValues: (values: T) => R;
  onSaved?: (saved: Saved<R>) => void;
}) {
  const [status, setStatus] = useState<TableSaveStatus>({ kind: 'idle' });
  const basedOn = useRef(revision);
  const theirs = useRef<Saved<R> | null>(null);

  // The table changed on the server by other means (an import, another tab): an untouched form
  // shows it; a form with edits keeps them, and its save is then refused as stale (409).
  useEffect(() => {
    if (revision === basedOn.current || form.formState.isDirty) return;
    basedOn.current = revision;
    form.reset(toValues(rows));
  }, [revision, rows, form, toValues]);

  const submit = useCallback(
    async (values: T) => {
      setStatus({ kind: 'saving' });
      try {
        const saved = await send(fromValues(values), basedOn.current);
        basedOn.current = saved.revision;
        form.reset(toValues(saved.rows));
        setStatus({ kind: 'saved', at: new Date() });
        onSaved?.(saved);
      } catch (error) {
        const problem = asProblem(error);
        if (problem.status === 409) {
          const current = stale(problem.body);
          if (current) {
            theirs.current = current;
            setStatus({ kind: 'conflict', at: new Date() });
            return;
          }
        }
        if (problem.status === 422 && problem.fields) {
          const entries = Object.entries(problem.fields);
          for (const [path, message] of entries) form.setError((path === '_' ? 'root.server' : path) as FieldPath<T>, { type: 'server', message });
          setStatus({ kind: 'invalid', problems: entries.length, message: problem.message });
          return;
        }
        setStatus({ kind: 'failed', message: problem.message });
      }
    },
    [form, send, stale, toValues, fromValues, onSaved],
  );

  const save = useCallback(
    () =>
      form.handleSubmit(submit, (errors) => {
        const problems = countErrors(errors);
        setStatus({ kind: 'invalid', problems, message: `${problems} field${problems === 1 ? '' : 's'} need${problems === 1 ? 's' : ''} fixing; nothing was saved.` });
      })(),
    [form, submit],
  );

  /** After a conflict: load the other person's table, or save mine over it on purpose. */
  const resolveConflict = useCallback(
    (choice: 'theirs' | 'mine') => {
      const current = theirs.current;
      if (!current) return;
      theirs.current = null;
      basedOn.current = current.revision;
      if (choice === 'theirs') {
        form.reset(toValues(current.rows));
        setStatus({ kind: 'idle' });
        return;
      }
      void save();
    },
    [form, save, toValues],
  );

  return { status, save, resolveConflict };
}

/** Leaf messages in react-hook-form's error tree. */
export function countErrors(errors: unknown): number {
  if (!errors || typeof errors !== 'object') return 0;
  if ('message' in errors && typeof (errors as { message?: unknown }).message === 'string' && 'type' in errors) return 1;
  return Object.entries(errors as Record<string, unknown>).reduce((n, [k, v]) => (k === 'ref' ? n : n + countErrors(v)), 0);
}

const time = (d: Date) => d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });

/** The Save button with what saving is doing, in words with an icon. */
export function TableSaveBar({
  status,
  dirty,
  onSave,
  onResolve,
  noun,
  testID,
}: {
  status: TableSaveStatus;
  dirty: boolean;
  onSave: () => void;
  onResolve: (choice: 'theirs' | 'mine') => void;
  noun: string;
  testID: string;
}) {
  let body: React.ReactNode = null;
  let bad = false;
  if (status.kind === 'saving') {
    body = <SavingNote />;
  } else if (status.kind === 'invalid' || status.kind === 'failed') {
    bad = true;
    body = (
      <>
        <Icon name="warning" size={16} color={palette.fail} strokeWidth={2} />
        <Text variant="smallStrong" tone="fail" style={styles.shrink}>
          {status.kind === 'invalid' ? `Not saved — ${status.message} Fix the highlighted field${status.problems === 1 ? '' : 's'}.` : `Not saved: ${status.message}`}
        </Text>
      </>
    );
  } else if (status.kind === 'conflict') {
    bad = true;
    body = (
      <>
        <Icon name="warning" size={16} color={palette.fail} strokeWidth={2} />
        <Text variant="smallStrong" tone="fail" style={styles.shrink}>
          Not saved — someone else saved the {noun} at {time(status.at)}.
        </Text>
        <Button label="Load theirs" variant="secondary" compact onPress={() => onResolve('theirs')} testID={`${testID}-theirs`} />
        <Button label="Keep mine" variant="secondary" compact onPress={() => onResolve('mine')} testID={`${testID}-mine`} />
      </>
    );
  } else if (dirty) {
    body = (
      <>
        <Icon name="pending" size={16} color={palette.caution} strokeWidth={2} />
        <Text variant="smallStrong" tone="caution">
          Unsaved changes
        </Text>
      </>
    );
  } else if (status.kind === 'saved') {
    body = (
      <>
        <Icon name="check" size={16} color={palette.pass} strokeWidth={2} />
        <Text variant="smallStrong" tone="pass">
          Saved {time(status.at)}
        </Text>
      </>
    );
  }
  return (
    <View style={styles.bar}>
      <Button label={`Save ${noun}`} icon="check" onPress={onSave} disabled={status.kind === 'saving' || status.kind === 'conflict'} testID={`${testID}-save`} />
      <View style={[styles.status, bad && styles.bad]} testID={`${testID}-status`} accessibilityLiveRegion="polite">
        {body}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  status: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.xs, minHeight: 28, flexShrink: 1 },
  bad: { backgroundColor: palette.failSoft, paddingHorizontal: space.sm, paddingVertical: space.xxs, borderRadius: radii.sm },
  shrink: { flexShrink: 1 },
});
