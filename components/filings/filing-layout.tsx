/**
 * The frame of one filing: from layout.wideMinWidthPx the step list on the left and the page on
 * the right; on a phone one page at a time (the overview is the step list's own screen).
 */
import { Link, Slot, usePathname } from 'expo-router';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { useFilingQuery } from '../../hooks/queries/filings';
import { useReadinessFollowsFiling } from '../../hooks/queries/review';
import { useIsWide } from '../../hooks/use-is-wide';
import { Icon } from '../icons';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { STATE_LOOK } from './labels';
import { pageOfPath } from './filing-pages';
import { StepList } from './step-list';
import { useFilingId } from './use-filing-id';

export function FilingLayout() {
  const id = useFilingId();
  const filing = useFilingQuery(id);
  const wide = useIsWide();
  const pathname = usePathname();
  useReadinessFollowsFiling(id, filing.dataUpdatedAt);
  // A malformed id never fetches (the query stays pending), so it is "not found" at once.
  if (!Number.isInteger(id) || id <= 0 || (filing.isError && asProblem(filing.error).status === 404)) {
    return (
      <Screen title="Filing not found" eyebrow="Filings" testID="filing-not-found">
        <Notice tone="error">There is no filing at this address, or it is not shared with you. Check the link, or open it from the list.</Notice>
        <Link href="/filings" asChild>
          <Pressable style={styles.back} accessibilityRole="link">
            <Icon name="chevronLeft" size={16} color={palette.accent} />
            <Text variant="smallStrong" tone="accent">
              All filings
            </Text>
          </Pressable>
        </Link>
      </Screen>
    );
  }
  // A refetch that fails (a session ending mid-edit answers 401) keeps the filing on screen, and with it the form and what was typed.
  if (!filing.data) {
    return (
      <Screen title="Filing" eyebrow="Filings">
        {filing.isPending ? <Loading label="Loading the filing…" /> : <LoadFailed what="this filing" error={filing.error} onRetry={() => void filing.refetch()} />}
      </Screen>
    );
  }
  if (!wide) return <Slot />;
  const f = filing.data;
  const state = STATE_LOOK[f.version.state];
  const active = pageOfPath(pathname);
  return (
    <View style={styles.panes}>
      <ScrollView style={styles.left} contentContainerStyle={styles.leftContent} testID="filing-steps-pane">
        <Link href="/filings" asChild>
          <Pressable style={styles.back} accessibilityLabel="All filings">
            <Icon name="chevronLeft" size={16} color={palette.inkMuted} />
            <Text variant="small" tone="muted">
              All filings
            </Text>
          </Pressable>
        </Link>
        <Link href={`/filings/${f.id}`} asChild>
          <Pressable
            style={StyleSheet.flatten([styles.identity, active === 'overview' && styles.identityActive])}
            testID="step-link-overview"
            aria-current={active === 'overview' ? 'page' : undefined}
          >
            <Text variant="heading" numberOfLines={2}>
              {f.device.name}
            </Text>
            <Text variant="small" tone="soft">
              {f.device.model} · version {f.version.number}
            </Text>
            <StatusBadge tone={state.tone} icon={state.icon} label={state.label} />
            {f.archivedAt ? <StatusBadge tone="caution" icon="info" label="Archived · read only" /> : null}
          </Pressable>
        </Link>
        <StepList filing={f} activeStep={active} />
      </ScrollView>
      <View style={styles.right}>
        <Slot />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  panes: { flex: 1, flexDirection: 'row' },
  left: { width: 300, flexGrow: 0, flexShrink: 0, backgroundColor: palette.surface, borderRightWidth: 1, borderRightColor: palette.line },
  leftContent: { padding: space.md, paddingTop: space.xl, gap: space.md },
  back: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: 32, paddingHorizontal: space.sm },
  identity: { gap: space.xs, padding: space.md, borderRadius: 8, borderWidth: 1, borderColor: palette.line, backgroundColor: palette.paper },
  identityActive: { borderColor: palette.accent },
  right: { flex: 1, minWidth: 0 },
});
