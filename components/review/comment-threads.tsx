/**
 * Review comments as threads on a step (and optionally a row): approvers start them while a
 * version is in review, the specialist answers and resolves them. What a role may not do is
 * hidden; the server checks it anyway.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import type { ReviewDto, ReviewThreadDto } from '../../constants/schemas/review';
import { WIZARD_STEPS } from '../../constants/schemas/filings';
import { useAddThreadMutation, useReplyMutation, useResolveMutation } from '../../hooks/queries/review';
import { formatDateTime } from '../format';
import { Button } from '../ui/button';
import { ChoiceChips } from '../ui/choice-chips';
import { InputBox } from '../ui/input-box';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { stepWord } from './readiness-checklist';

const where = (t: Pick<ReviewThreadDto, 'step' | 'rowRef'>) => `${t.step === 'overview' ? 'Overview' : stepWord(t.step)}${t.rowRef ? ` · row ${t.rowRef}` : ''}`;
const problemText = (e: unknown) => (e as { fields?: Record<string, string>; message?: string } | null)?.fields?.body ?? (e as Error | null)?.message;

export function CommentThreads({ filingId, review }: { filingId: number; review: ReviewDto }) {
  const open = review.threads.filter((t) => t.state === 'open').length;
  return (
    <View style={styles.wrap} testID="review-threads">
      <Text variant="small" tone="soft" testID="threads-count">
        {review.threads.length ? `${review.threads.length} thread${review.threads.length === 1 ? '' : 's'}, ${open} open.` : 'No comments yet.'}
      </Text>
      {review.threads.map((t) => (
        <Thread key={t.id} filingId={filingId} thread={t} review={review} />
      ))}
      {review.can.comment.allowed ? <NewThread filingId={filingId} /> : null}
    </View>
  );
}

function Thread({ filingId, thread, review }: { filingId: number; thread: ReviewThreadDto; review: ReviewDto }) {
  const [reply, setReply] = useState('');
  const replying = useReplyMutation(filingId);
  const resolving = useResolveMutation(filingId);
  const resolved = thread.state === 'resolved';
  return (
    <View style={[styles.thread, resolved && styles.resolved]} testID={`thread-${thread.id}`}>
      <View style={styles.threadHead}>
        <Text variant="smallStrong" style={{ flex: 1 }}>
          {where(thread)}
        </Text>
        <StatusBadge tone={resolved ? 'pass' : 'caution'} icon={resolved ? 'check' : 'info'} label={resolved ? 'Resolved' : 'Open'} />
      </View>
      {thread.comments.map((c) => (
        <View key={c.id} style={styles.comment}>
          <Text variant="small" tone="muted">
            {c.author.name} · {formatDateTime(c.createdAt)}
          </Text>
          <Text variant="body">{c.body}</Text>
        </View>
      ))}
      {review.can.reply.allowed ? (
        <View style={styles.replyRow}>
          <InputBox
            label="Answer"
            hideLabel
            placeholder="Write an answer…"
            value={reply}
            onChangeText={setReply}
            multiline
            error={problemText(replying.error)}
            testID={`thread-${thread.id}-reply`}
          />
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
                label={resolved ? 'Reopen' : 'Mark resolved'}
                variant="secondary"
                compact
                icon={resolved ? undefined : 'check'}
                busy={resolving.isPending}
                onPress={() => resolving.mutate({ threadId: thread.id, resolved: !resolved })}
                testID={`thread-${thread.id}-resolve`}
              />
            ) : null}
          </View>
        </View>
      ) : null}
    </View>
  );
}

const STEP_CHOICES = [{ value: 'overview', label: 'Overview' }, ...WIZARD_STEPS.map((s) => ({ value: s, label: stepWord(s) }))];

function NewThread({ filingId }: { filingId: number }) {
  const [step, setStep] = useState<string>('radios');
  const [rowRef, setRowRef] = useState('');
  const [body, setBody] = useState('');
  const adding = useAddThreadMutation(filingId);
  return (
    <View style={styles.newThread} testID="new-thread">
      <Text variant="bodyStrong">New comment</Text>
      <ChoiceChips label="About the step" choices={STEP_CHOICES} value={step} onChange={(v: string) => setStep(v)} testID="new-thread-step" />
      <InputBox label="Row (optional)" hint="The id of a transmitter, antenna or use position, for example LTE-B2." value={rowRef} onChangeText={setRowRef} testID="new-thread-row" />
      <InputBox label="Comment" value={body} onChangeText={setBody} multiline error={problemText(adding.error)} testID="new-thread-body" />
      {adding.isSuccess && !body ? <Notice tone="success">Comment added.</Notice> : null}
      <Button
        label="Add comment"
        icon="plus"
        compact
        busy={adding.isPending}
        disabled={!body.trim()}
        style={{ alignSelf: 'flex-start' }}
        onPress={() => adding.mutate({ step, rowRef: rowRef.trim() || undefined, body }, { onSuccess: () => (setBody(''), setRowRef('')) })}
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
