/** The top of a data step: the autosave status, and why the form is read-only or started from a draft. */
import { sourceWords } from '../source-words';
import { useEffect, useRef } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import type { FieldValues } from 'react-hook-form';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { timeOfDay } from './format';
import { SaveIndicator } from './save-indicator';
import type { StepForm } from './use-step-form';

export function StepFrame<T extends FieldValues>({ stepForm, intro, children }: { stepForm: StepForm<T>; intro?: string; children: React.ReactNode }) {
  const { autosave, editable, draft, form } = stepForm;
  const status = autosave.status;
  const onRetry = () => void autosave.saveNow();
  const draftAt = draft?.updatedAt ?? null;
  const rootError = form.formState.errors.root?.server?.message;
  return (
    <View style={styles.frame}>
      <View style={styles.bar}>
        {intro ? (
          <Text variant="small" tone="soft" style={styles.intro}>
            {intro}
          </Text>
        ) : null}
        <SaveIndicator status={status} onRetry={onRetry} readOnly={!editable} />
      </View>
      {status.kind === 'conflict' ? <ConflictNotice changed={status.changed} onChoose={autosave.resolveConflict} /> : null}
      {!editable ? (
        <Notice tone="info" title="Read only" testID="step-read-only">
          Only a compliance specialist changes a filing’s device data, and only while its version is a draft or has been returned to them.
        </Notice>
      ) : null}
      {draftAt && editable ? (
        <Notice tone="caution" title="Started from your unsaved draft" testID="step-draft-notice">
          {`These are the changes you made at ${timeOfDay(draftAt)}; they are not saved yet because some fields need fixing. The last saved data stays in use until they are fixed.`}
        </Notice>
      ) : null}
      {rootError ? <Notice tone="error">{rootError}</Notice> : null}
      {children}
    </View>
  );
}

/** Someone else saved this step meanwhile: say what differs and let the person choose. */
function ConflictNotice({ changed, onChoose }: { changed: string[]; onChoose: (choice: 'theirs' | 'mine') => void }) {
  const shown = changed.slice(0, 6);
  const box = useRef<View>(null);
  // On a phone the person is usually far down the form when it happens: bring the choice to them.
  useEffect(() => {
    if (Platform.OS === 'web') (box.current as unknown as HTMLElement | null)?.scrollIntoView?.({ block: 'center', behavior: 'smooth' });
  }, []);
  return (
    <Notice tone="error" title="Someone else saved this step while you were editing" testID="step-conflict">
      <View style={styles.conflict} ref={box}>
        <Text variant="small">Your latest changes are not saved. {changed.length ? 'Where the two differ:' : 'Their version holds the same values as yours.'}</Text>
        {shown.map((c) => (
          <Text key={c} variant="small">
            {`• ${sourceWords(c)}`}
          </Text>
        ))}
        {changed.length > shown.length ? <Text variant="small" tone="soft">{`…and ${changed.length - shown.length} more`}</Text> : null}
        <View style={styles.choices}>
          <Button label="Load their version" variant="secondary" onPress={() => onChoose('theirs')} testID="conflict-theirs" />
          <Button label="Keep mine and save it" onPress={() => onChoose('mine')} testID="conflict-mine" />
        </View>
      </View>
    </Notice>
  );
}

const styles = StyleSheet.create({
  conflict: { gap: space.xs },
  choices: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.xs },
  frame: { gap: space.lg },
  bar: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.sm,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
    backgroundColor: palette.surface,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.line,
  },
  intro: { flex: 1, minWidth: 200 },
});
