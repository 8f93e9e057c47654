/**
 * What the signed-in person can do with the version now: ask for review (specialist), return
 * with a note or sign with their password (approver), start the next version (specialist, once
 * signed). Actions a role cannot take are not shown; a refusal from the server is shown inline.
 */
import { Link, useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import type { ReviewDto } from '../../constants/schemas/review';
import { useRequestReviewMutation, useReturnMutation, useSignMutation, useStartNextVersionMutation, type FilingReadiness } from '../../hooks/queries/review';
import { isFilingPage, PAGE_LABELS, type FilingPage } from '../filings/filing-pages';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { InputBox } from '../ui/input-box';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

const messageOf = (e: unknown) => (e as Error | null)?.message;
const fieldsOf = (e: unknown) => (e as { fields?: Record<string, string> } | null)?.fields;
export const blockingItemsOf = (r: FilingReadiness) => r.items.filter((i) => i.status === 'fail' && i.severity === 'blocks-signing');

export function RequestReviewAction({ filingId, review, readiness }: { filingId: number; review: ReviewDto; readiness: FilingReadiness }) {
  const asking = useRequestReviewMutation(filingId);
  if (!review.can['request-review'].allowed) return null;
  const blocking = blockingItemsOf(readiness);
  const open = review.threads.filter((t) => t.state === 'open').length;
  return (
    <View style={styles.block} testID="request-review-form">
      {blocking.length ? (
        <Notice
          tone="caution"
          title={`Not ready for review: ${blocking.length} item${blocking.length === 1 ? '' : 's'} block${blocking.length === 1 ? 's' : ''} signing`}
          testID="request-review-blocked"
        >
          <View style={styles.items}>
            {blocking.map((i) => (
              <Link key={i.id} href={isFilingPage(i.step) ? `/filings/${filingId}/${i.step}` : `/filings/${filingId}/readiness`} asChild>
                <Pressable accessibilityRole="link" style={styles.itemLink} testID={`blocking-${i.id}`}>
                  <Text variant="smallStrong" tone="copper" style={{ flexShrink: 1 }}>
                    {`${i.title} — fix under ${PAGE_LABELS[i.step as FilingPage] ?? i.step}`}
                  </Text>
                  <Icon name="chevronRight" size={14} color={palette.copper} />
                </Pressable>
              </Link>
            ))}
          </View>
        </Notice>
      ) : null}
      {!blocking.length && open ? (
        <Notice tone="info" testID="request-review-open-threads">
          {`${open} comment${open === 1 ? ' is' : 's are'} still open. Answer ${open === 1 ? 'it' : 'them'}, and mark ${open === 1 ? 'it' : 'them'} resolved once fixed, so the approver sees what changed.`}
        </Notice>
      ) : null}
      {asking.error ? (
        <Notice tone="error" testID="request-review-error">
          {messageOf(asking.error)}
        </Notice>
      ) : null}
      <Button
        label={review.version.state === 'returned' ? 'Ask for review again' : 'Ask for review'}
        icon="chevronRight"
        disabled={blocking.length > 0}
        busy={asking.isPending}
        onPress={() => asking.mutate()}
        style={styles.button}
        testID="request-review"
      />
    </View>
  );
}

export function ReturnAction({ filingId, review }: { filingId: number; review: ReviewDto }) {
  const [note, setNote] = useState('');
  const returning = useReturnMutation(filingId);
  if (!review.can.return.allowed) return null;
  return (
    <View style={[styles.block, styles.separated]} testID="return-form">
      <Text variant="bodyStrong">Return for changes</Text>
      <Text variant="small" tone="soft">
        The specialist gets your open comments and this note by mail.
      </Text>
      <InputBox label="Note (optional when you left comments)" value={note} onChangeText={setNote} multiline error={fieldsOf(returning.error)?.message} testID="return-note" />
      {returning.error && !fieldsOf(returning.error)?.message ? <Notice tone="error">{messageOf(returning.error)}</Notice> : null}
      <Button
        label="Return with comments"
        variant="secondary"
        icon="chevronLeft"
        busy={returning.isPending}
        onPress={() => returning.mutate({ message: note.trim() || undefined })}
        style={styles.button}
        testID="return-version"
      />
    </View>
  );
}

export function SignAction({ filingId, review, ready }: { filingId: number; review: ReviewDto; ready: boolean }) {
  const [password, setPassword] = useState('');
  const signing = useSignMutation(filingId);
  const canSign = review.can.sign;
  if (!canSign.allowed) {
    // An approver who may not sign this version is told why (separation of duties).
    return canSign.reason && review.version.state === 'in-review' && /another approver/.test(canSign.reason) ? (
      <Notice tone="info" title="Someone else signs this version" testID="sign-refused-reason">
        {canSign.reason}
      </Notice>
    ) : null;
  }
  const fields = fieldsOf(signing.error);
  return (
    <View style={styles.block} testID="sign-form">
      <Text variant="bodyStrong">Sign version {review.version.number}</Text>
      <View style={styles.statement} testID="signing-statement">
        <Text variant="body">“{review.signingStatement}”</Text>
      </View>
      <InputBox
        label="Your password"
        hint="Signing asks for your password again, whatever your session."
        value={password}
        onChangeText={setPassword}
        secureTextEntry
        autoComplete="current-password"
        error={fields?.password}
        testID="sign-password"
      />
      {signing.error && !fields?.password ? (
        <Notice tone="error" title="Not signed" testID="sign-error">
          {messageOf(signing.error)}
        </Notice>
      ) : null}
      <Button
        label="Sign this version"
        icon="lock"
        disabled={!ready || !password}
        busy={signing.isPending}
        busyLabel="Signing…"
        onPress={() => signing.mutate({ password, statement: review.signingStatement as never }, { onSettled: () => setPassword('') })}
        style={styles.button}
        testID="sign-version"
      />
    </View>
  );
}

export function StartNextVersionAction({ filingId, review }: { filingId: number; review: ReviewDto }) {
  const starting = useStartNextVersionMutation(filingId);
  const router = useRouter();
  if (!review.can['start-next-version'].allowed) return null;
  return (
    <View style={styles.block}>
      <Text variant="small" tone="soft">
        Version {review.version.number} is signed and frozen. To change anything, start version {review.version.number + 1}: a draft copy you edit and send for review again.
      </Text>
      {starting.error ? <Notice tone="error">{messageOf(starting.error)}</Notice> : null}
      <Button
        label={`Start version ${review.version.number + 1}`}
        icon="plus"
        busy={starting.isPending}
        onPress={() => starting.mutate(undefined, { onSuccess: () => router.push(`/filings/${filingId}`) })}
        style={styles.button}
        testID="start-next-version"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  block: { gap: space.sm },
  button: { alignSelf: 'flex-start' },
  items: { gap: space.xxs },
  // Set apart from the signing form above it.
  separated: { borderTopWidth: 1, borderTopColor: palette.line, paddingTop: space.md },
  itemLink: { flexDirection: 'row', alignItems: 'center', gap: 4, minHeight: 32 },
  statement: { paddingLeft: space.md, borderLeftWidth: 3, borderLeftColor: '#B8652A' },
});
