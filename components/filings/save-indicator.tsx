/** What autosave is doing, in words with an icon: saving, saved at, or what stops it. */
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { palette, radii, space } from '../../constants/theme';
import type { AutosaveStatus } from '../../hooks/use-autosave';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

/** The spinner and "Saving…" that every save in the wizard shows while its request is out. */
export function SavingNote() {
  return (
    <>
      <ActivityIndicator size="small" color={palette.accent} accessibilityLabel="Saving" />
      <Text variant="small" tone="soft">
        Saving…
      </Text>
    </>
  );
}

const time = (d: Date) => d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });

export function SaveIndicator({ status, onRetry, readOnly }: { status: AutosaveStatus; onRetry: () => void; readOnly?: boolean }) {
  if (readOnly) {
    return (
      <View style={styles.row} testID="save-status" accessibilityLiveRegion="polite">
        <Icon name="lock" size={16} color={palette.inkMuted} />
        <Text variant="small" tone="muted">
          Read only
        </Text>
      </View>
    );
  }
  let body: React.ReactNode;
  switch (status.kind) {
    case 'idle':
      body = (
        <>
          <Icon name="check" size={16} color={palette.inkMuted} />
          <Text variant="small" tone="muted">
            Changes save as you type
          </Text>
        </>
      );
      break;
    case 'pending':
    case 'saving':
      body = <SavingNote />;
      break;
    case 'saved':
      body = (
        <>
          <Icon name="check" size={16} color={palette.pass} strokeWidth={2} />
          <Text variant="smallStrong" tone="pass">
            Saved {time(status.at)}
          </Text>
        </>
      );
      break;
    case 'invalid':
      body = (
        <>
          <Icon name="warning" size={16} color={palette.fail} strokeWidth={2} />
          <Text variant="smallStrong" tone="fail" style={styles.shrink}>
            Not saved — fix the highlighted field{status.problems === 1 ? '' : 's'} (draft kept {time(status.at)})
          </Text>
        </>
      );
      break;
    case 'waiting':
      body = (
        <>
          <Icon name="pending" size={16} color={palette.caution} strokeWidth={2} />
          <Text variant="smallStrong" tone="caution" style={styles.shrink}>
            {status.reason === 'signed-out' ? 'Kept here — saves once you have signed in again' : 'Offline — kept here, saves when the connection is back'}
          </Text>
        </>
      );
      break;
    case 'conflict':
      body = (
        <>
          <Icon name="warning" size={16} color={palette.fail} strokeWidth={2} />
          <Text variant="smallStrong" tone="fail" style={styles.shrink}>
            Not saved — someone else saved this step at {time(status.at)}
          </Text>
        </>
      );
      break;
    case 'failed':
      body = (
        <>
          <Icon name="warning" size={16} color={palette.fail} strokeWidth={2} />
          <Text variant="smallStrong" tone="fail" style={styles.shrink}>
            Not saved: {status.message}
          </Text>
          <Button label="Try again" variant="secondary" compact onPress={onRetry} />
        </>
      );
      break;
  }
  return (
    <View style={[styles.row, status.kind === 'invalid' || status.kind === 'failed' || status.kind === 'conflict' ? styles.bad : null]} testID="save-status" accessibilityLiveRegion="polite">
      {body}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: 28, flexShrink: 1 },
  bad: { backgroundColor: palette.failSoft, paddingHorizontal: space.sm, paddingVertical: space.xxs, borderRadius: radii.sm },
  shrink: { flexShrink: 1 },
});
