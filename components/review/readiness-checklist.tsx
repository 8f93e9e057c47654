/**
 * The readiness checklist: a count per severity, then every item with an icon and a word (never
 * colour alone), what fails, how to fix it, the step that fixes it and its source.
 */
import { sourceWords } from '../source-words';
import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import type { ReadinessItem } from '../../calc/readiness';
import { palette, radii, space } from '../../constants/theme';
import type { FilingReadiness } from '../../hooks/queries/review';
import { PAGE_LABELS, type FilingPage } from '../filings/filing-pages';
import { Icon, type IconName } from '../icons';
import { StatusBadge, type BadgeTone } from '../ui/status-badge';
import { Text } from '../ui/text';

export const stepWord = (s: string) => PAGE_LABELS[s as FilingPage] ?? s;
/** Pages that exist as screens today; others are named but not linked. */
const LINKED_STEPS = new Set<string>(Object.keys(PAGE_LABELS));

function itemLook(i: ReadinessItem): { icon: IconName; tone: BadgeTone; word: string } {
  if (i.status === 'pass') return { icon: 'check', tone: 'pass', word: 'Holds' };
  if (i.status === 'not-applicable') return { icon: 'pending', tone: 'neutral', word: 'Does not apply' };
  return i.severity === 'blocks-signing' ? { icon: 'blocked', tone: 'fail', word: 'Blocks signing' } : { icon: 'warning', tone: 'caution', word: 'Warning' };
}

export function ReadinessCounts({ readiness, testID = 'readiness-counts' }: { readiness: FilingReadiness; testID?: string }) {
  const { counts, ready } = readiness;
  // A signed version is past signing: its checklist only says that nothing blocks.
  const readyWord = readiness.state === 'signed' ? 'Nothing blocks signing' : 'Ready to sign';
  return (
    <View style={styles.counts} testID={testID}>
      <StatusBadge tone={ready ? 'pass' : 'fail'} icon={ready ? 'check' : 'blocked'} label={ready ? readyWord : 'Not ready'} testID="readiness-verdict" />
      <Text variant="small" tone="soft">
        {counts.blocking} blocking · {counts.warnings} warning{counts.warnings === 1 ? '' : 's'} · {counts.passed} holding · {counts.notApplicable} not applicable
      </Text>
    </View>
  );
}

export function ReadinessChecklistView({ readiness, filingId, onlyFailing }: { readiness: FilingReadiness; filingId: number; onlyFailing?: boolean }) {
  const order = { fail: 0, pass: 1, 'not-applicable': 2 } as const;
  const items = [...readiness.items]
    .filter((i) => !onlyFailing || i.status === 'fail')
    .sort((a, b) => order[a.status] - order[b.status] || (a.severity === b.severity ? 0 : a.severity === 'blocks-signing' ? -1 : 1));
  return (
    <View role="list" accessibilityLabel="Readiness checklist" style={styles.list} testID="readiness-list">
      {items.map((i) => (
        <ChecklistRow key={i.id} item={i} filingId={filingId} />
      ))}
    </View>
  );
}

function ChecklistRow({ item, filingId }: { item: ReadinessItem; filingId: number }) {
  const look = itemLook(item);
  const failing = item.status === 'fail';
  return (
    <View role="listitem" style={[styles.row, failing && (item.severity === 'blocks-signing' ? styles.rowBlocking : styles.rowWarning)]} testID={`readiness-item-${item.id}`}>
      <View style={styles.head}>
        <Text variant="bodyStrong" style={{ flex: 1, minWidth: 180 }}>
          {item.title}
        </Text>
        <StatusBadge tone={look.tone} icon={look.icon} label={look.word} testID={`readiness-state-${item.id}`} />
      </View>
      {failing ? (
        <View style={styles.findings}>
          {item.findings.map((f, n) => (
            <View key={n} style={styles.finding}>
              <Icon name="chevronRight" size={14} color={palette.inkMuted} />
              <Text variant="small" style={{ flex: 1 }}>
                {sourceWords(f.text)}
              </Text>
            </View>
          ))}
          <Text variant="small" tone="soft">
            {sourceWords(item.fix)}
          </Text>
          <StepLink filingId={filingId} step={item.step} />
        </View>
      ) : null}
      <Text variant="small" tone="muted">
        Source: {sourceWords(item.source)}
      </Text>
    </View>
  );
}

function StepLink({ filingId, step }: { filingId: number; step: string }) {
  if (!LINKED_STEPS.has(step)) {
    return (
      <Text variant="smallStrong" tone="soft">
        Fixed under: {stepWord(step)}
      </Text>
    );
  }
  return (
    <Link href={`/filings/${filingId}/${step}`} asChild>
      <Pressable accessibilityRole="link" style={styles.link}>
        <Text variant="smallStrong" tone="copper">
          Fix it under {stepWord(step)}
        </Text>
        <Icon name="chevronRight" size={14} color={palette.copper} />
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  counts: { gap: space.xs, alignItems: 'flex-start' },
  list: { gap: space.sm },
  row: { gap: space.xs, padding: space.md, borderRadius: radii.md, borderWidth: 1, borderColor: palette.line, backgroundColor: palette.surface },
  rowBlocking: { borderLeftWidth: 4, borderLeftColor: palette.fail },
  rowWarning: { borderLeftWidth: 4, borderLeftColor: palette.caution },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  findings: { gap: space.xxs },
  finding: { flexDirection: 'row', gap: space.xs, alignItems: 'flex-start' },
  link: { flexDirection: 'row', alignItems: 'center', gap: 4, alignSelf: 'flex-start', minHeight: 32 },
});
