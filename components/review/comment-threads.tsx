/**
 * Review comments as threads on a step (and optionally one of its rows): approvers start them
 * while a version is in review, the specialist answers and resolves them (the approver may answer
 * too). Given a `step`, only that step's threads are shown and a new comment is about that step.
 * What a role may not do is hidden; the server checks it anyway.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import type { FilingDetail } from '../../constants/schemas/filings';
import type { ReviewDto, ReviewThreadDto } from '../../constants/schemas/review';
import { useAddThreadMutation, useReplyMutation, useResolveMutation } from '../../hooks/queries/review';
import { FILING_PAGES, PAGE_LABELS, rowChoices, threadsOn } from '../filings/filing-pages';
import { formatDateTime } from '../format';
import { Button } from '../ui/button';
import { ChoiceChips } from '../ui/choice-chips';
import { InputBox } from '../ui/input-box';
import { Notice } from '../ui/notice';
import { SelectField } from '../ui/select-field';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { stepWord } from './readiness-checklist';

const where = (t: Pick<ReviewThreadDto, 'step' | 'rowRef'>) => `${t.step === 'overview' ? 'Overview' : stepWord(t.step)}${t.rowRef ? ` · ${t.rowRef}` : ''}`;
const problemText = (e: unknown) => (e as { fields?: Record<string, string>; message?: string } | null)?.fields?.body ?? (e as Error | null)?.message;

/** "2 threads, 1 open." */
export function threadCountWords(threads: ReviewThreadDto[]): string {
  if (!threads.length) return 'No comments yet.';
  const open = threads.filter((t) => t.state === 'open').length;
  return `${threads.length} thread${threads.length === 1 ? '' : 's'}, ${open} open.`;
}

export function CommentThreads({ filing, review, step }: { filing: FilingDetail; review: ReviewDto; step?: string }) {
  const threads = step ? threadsOn(review.threads, step) : review.threads;
  // Open threads first: they are what is left to do.
  const ordered = [...threads].sort((a, b) => (a.state === b.state ? a.id - b.id : a.state === 'open' ? -1 : 1));
  return (
    <View style={styles.wrap} testID={step ? `step-threads-${step}` : 'review-threads'}>
      <Text variant="small" tone="soft" testID="threads-count">
        {threadCountWords(threads)}
      </Text>
      {ordered.map((t) => (
        <Thread key={t.id} filingId={filing.id} thread={t} review={review} showWhere={!step} />
      ))}
      {review.can.comment.allowed ? <NewThread filing={filing} fixedStep={step} /> : null}
    </View>
  );
}

function Thread({ filingId, thread, review, showWhere }: { filingId: number; thread: ReviewThreadDto; review: ReviewDto; showWhere: boolean }) {
  const [reply, setReply] = useState('');
  const replying = useReplyMutation(filingId);
  const resolving = useResolveMutation(filingId);
  const resolved = thread.state === 'resolved';
  return (
    <View style={[styles.thread, resolved && styles.resolved]} testID={`thread-${thread.id}`}>
      <View style={styles.threadHead}>
        <Text variant="smallStrong" style={{ flex: 1 }}>
          {showWhere || !thread.rowRef ? where(thread) : thread.rowRef}
        </Text>
        <StatusBadge tone={resolved ? 'pass' : 'caution'} icon={resolved ? 'check' : 'info'} label={resolved ? 'Resolved' : 'Open'} testID={`thread-${thread.id}-state`} />
      </View>
      {thread.comments.map((c) => (
        <View key={c.id} style={styles.comment}>
          <Text variant="small" tone="muted">
            {c.author.name} · {formatDateTime(c.createdAt)}
          </Text>
          <Text variant="body">{c.body}</Text>
        </View>
      ))}
      {review.can.reply.allowed && !resolved ? (
        <View style={styles.replyRow}>
          <InputBox label="Answer" hideLabel placeholder="Write an answer…" value={reply} onChangeText={setReply} multiline error={problemText(replying.error)} testID={`thread-${thread.id}-reply`} />
          <View style={styles.actions}>
            <Button
              label="Send answer"
              compact
              busy={replying.isPending}
              disabled={!reply.trim()}
              onPress={() => replying.mutate({ threadId: thread.id, body: reply }, { onSuccess: () => setReply('') })}
              testID={`thread-${thread.id}-send`}
            />
            {review.can.resolve.allowed ? (
              <Button
                label="Mark resolved"
                variant="secondary"
                compact
                icon="check"
                busy={resolving.isPending}
                onPress={() => resolving.mutate({ threadId: thread.id, resolved: true })}
                testID={`thread-${thread.id}-resolve`}
              />
            ) : null}
          </View>
        </View>
      ) : null}
      {resolved && review.can.resolve.allowed ? (
        <Button
          label="Reopen"
          variant="secondary"
          compact
          busy={resolving.isPending}
          onPress={() => resolving.mutate({ threadId: thread.id, resolved: false })}
          style={{ alignSelf: 'flex-start' }}
          testID={`thread-${thread.id}-reopen`}
        />
      ) : null}
    </View>
  );
}

const STEP_CHOICES = [{ value: 'overview', label: 'Overview' }, ...FILING_PAGES.filter((p) => p !== 'review').map((p) => ({ value: p, label: PAGE_LABELS[p] }))];
const WHOLE_STEP = '';

function NewThread({ filing, fixedStep }: { filing: FilingDetail; fixedStep?: string }) {
  const [chosenStep, setStep] = useState<string>('radios');
  const step = fixedStep ?? chosenStep;
  const [rowRef, setRowRef] = useState(WHOLE_STEP);
  const [body, setBody] = useState('');
  const adding = useAddThreadMutation(filing.id);
  const rows = rowChoices(filing.data, step);
  return (
    <View style={styles.newThread} testID="new-thread">
      <Text variant="bodyStrong">{fixedStep ? `New comment on ${step === 'overview' ? 'the overview' : stepWord(step)}` : 'New comment'}</Text>
      {!fixedStep ? (
        <SelectField
          label="About the step"
          options={STEP_CHOICES}
          value={step}
          onChange={(v) => {
            setStep(v);
            setRowRef(WHOLE_STEP);
          }}
          testID="new-thread-step"
        />
      ) : null}
      {rows.length ? <ChoiceChips label="About the row" choices={[{ value: WHOLE_STEP, label: 'The whole step' }, ...rows]} value={rowRef} onChange={setRowRef} testID="new-thread-row" /> : null}
      <InputBox label="Comment" value={body} onChangeText={setBody} multiline error={problemText(adding.error)} testID="new-thread-body" />
      {adding.isSuccess && !body ? <Notice tone="success">Comment added. Return the version when you have left every comment.</Notice> : null}
      <Button
        label="Add comment"
        icon="plus"
        compact
        busy={adding.isPending}
        disabled={!body.trim()}
        style={{ alignSelf: 'flex-start' }}
        onPress={() => adding.mutate({ step, rowRef: rowRef || undefined, body }, { onSuccess: () => (setBody(''), setRowRef(WHOLE_STEP)) })}
        testID="new-thread-add"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  thread: { gap: space.xs, padding: space.md, borderRadius: radii.md, borderWidth: 1, borderColor: palette.line, backgroundColor: palette.surface },
  resolved: { backgroundColor: palette.paper },
  threadHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  comment: { gap: 2, paddingLeft: space.sm, borderLeftWidth: 2, borderLeftColor: palette.paperDeep },
  replyRow: { gap: space.xs },
  actions: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  newThread: { gap: space.sm, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: palette.line },
});
