/**
 * What the signed-in person can do with the version now: ask for review (specialist), return
 * with a note or sign with their password (approver), start the next version (specialist, once
 * signed). Actions a role cannot take are not shown; a refusal from the server is shown inline.
 */
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { space } from '../../constants/theme';
import type { ReviewDto } from '../../constants/schemas/review';
import { useRequestReviewMutation, useReturnMutation, useSignMutation, useStartNextVersionMutation } from '../../hooks/queries/review';
import { Button } from '../ui/button';
import { InputBox } from '../ui/input-box';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

const messageOf = (e: unknown) => (e as Error | null)?.message;
const fieldsOf = (e: unknown) => (e as { fields?: Record<string, string> } | null)?.fields;

export function RequestReviewAction({ filingId, review, ready }: { filingId: number; review: ReviewDto; ready: boolean }) {
  const asking = useRequestReviewMutation(filingId);
  if (!review.can['request-review'].allowed) return null;
  return (
    <View style={styles.block}>
      {!ready ? (
        <Notice tone="caution" title="Not ready for review">
          Items that block signing must be fixed before an approver can review this version.
        </Notice>
      ) : null}
      {asking.error ? (
        <Notice tone="error" testID="request-review-error">
          {messageOf(asking.error)}
        </Notice>
      ) : null}
      <Button label="Ask for review" icon="chevronRight" disabled={!ready} busy={asking.isPending} onPress={() => asking.mutate()} style={styles.button} testID="request-review" />
    </View>
  );
}

export function ReturnAction({ filingId, review }: { filingId: number; review: ReviewDto }) {
  const [note, setNote] = useState('');
  const returning = useReturnMutation(filingId);
  if (!review.can.return.allowed) return null;
  return (
    <View style={styles.block} testID="return-form">
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
  statement: { paddingLeft: space.md, borderLeftWidth: 3, borderLeftColor: '#B8652A' },
});
