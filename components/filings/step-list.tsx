/**
 * The filing's pages with each one's state in words: the wizard's steps (completion, what is
 * missing), then Readiness (the count per severity) and Review and signing (the version's state).
 * Every entry is a link.
 */
import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { type FilingDetail, type VersionState } from '../../constants/schemas/filings';
import { layout, palette, radii, space } from '../../constants/theme';
import { useReadinessQuery } from '../../hooks/queries/review';
import { Icon, type IconName } from '../icons';
import { Text } from '../ui/text';
import { PAGE_LABELS, readinessWords, type FilingPage } from './filing-pages';

type Look = { icon: IconName; color: string; word: string };

/** Screening shows a table as soon as one transmitter, one use position and one market exist. */
const canScreenSome = (d: FilingDetail['data']) => d.radios.transmitters.length > 0 && d['use-positions'].usePositions.length > 0 && d.markets.markets.length > 0;

function stepLook(s: FilingDetail['steps'][number], filing: FilingDetail): Look {
  if (s.hasDraft) return { icon: 'warning', color: palette.fail, word: 'Unsaved changes' };
  if (s.complete) return { icon: 'check', color: palette.pass, word: 'Complete' };
  if (s.step === 'screening') {
    return canScreenSome(filing.data) ? { icon: 'pending', color: palette.caution, word: 'Partial' } : { icon: 'blocked', color: palette.inkMuted, word: 'Needs earlier steps' };
  }
  return { icon: 'pending', color: palette.caution, word: 'Incomplete' };
}

const REVIEW_LOOK: Record<VersionState, Look> = {
  draft: { icon: 'pending', color: palette.inkMuted, word: 'Not asked yet' },
  'in-review': { icon: 'info', color: palette.caution, word: 'In review' },
  returned: { icon: 'warning', color: palette.caution, word: 'Returned' },
  signed: { icon: 'lock', color: palette.pass, word: 'Signed' },
};

/**
 * `wizardOnly` lists the data and computed steps alone (the review page lists them to read).
 * `compact` leaves out what is missing.
 */
export function StepList({ filing, activeStep, compact, wizardOnly }: { filing: FilingDetail; activeStep?: FilingPage | 'overview' | 'compare'; compact?: boolean; wizardOnly?: boolean }) {
  const readiness = useReadinessQuery(wizardOnly ? 0 : filing.id);
  const readinessLook: Look = !readiness.data
    ? { icon: 'pending', color: palette.inkMuted, word: readiness.isError ? 'Could not check' : 'Checking…' }
    : readiness.data.counts.blocking
      ? { icon: 'blocked', color: palette.fail, word: readinessWords(readiness.data.counts) }
      : readiness.data.counts.warnings
        ? { icon: 'warning', color: palette.caution, word: readinessWords(readiness.data.counts) }
        : { icon: 'check', color: palette.pass, word: 'Ready' };
  const entries: { page: FilingPage; look: Look; problems: string[]; warnings: string[] }[] = filing.steps.map((s) => ({
    page: s.step,
    look: stepLook(s, filing),
    problems: s.problems,
    warnings: s.warnings ?? [],
  }));
  if (!wizardOnly) {
    entries.push({ page: 'readiness', look: readinessLook, problems: [], warnings: [] });
    entries.push({ page: 'review', look: REVIEW_LOOK[filing.version.state], problems: [], warnings: [] });
  }
  return (
    <View role="list" accessibilityLabel="Steps" style={styles.list} testID="step-list">
      {entries.map((e, i) => {
        const { look } = e;
        const active = e.page === activeStep;
        return (
          <Link key={e.page} href={`/filings/${filing.id}/${e.page}`} asChild>
            <Pressable
              role="listitem"
              accessibilityLabel={`Step ${i + 1}: ${PAGE_LABELS[e.page]}, ${look.word}`}
              aria-current={active ? 'step' : undefined}
              testID={`step-link-${e.page}`}
              style={StyleSheet.flatten([styles.item, active && styles.active, e.page === 'readiness' && styles.firstReview])}
            >
              <View style={[styles.number, active && styles.numberActive]}>
                <Text variant="smallStrong" style={[styles.numberText, { color: active ? palette.onInk : palette.inkSoft }]}>
                  {i + 1}
                </Text>
              </View>
              <View style={styles.body}>
                <View style={styles.titleRow}>
                  <Text variant="bodyStrong" style={{ flex: 1 }}>
                    {PAGE_LABELS[e.page]}
                  </Text>
                  <View style={styles.state} testID={`step-state-${e.page}`}>
                    <Icon name={look.icon} size={15} color={look.color} strokeWidth={2} />
                    <Text variant="small" style={{ color: look.color }}>
                      {look.word}
                    </Text>
                  </View>
                </View>
                {e.problems.length && !compact ? (
                  <View style={styles.problems}>
                    {e.problems.map((p) => (
                      <Text key={p} variant="small" tone="soft">
                        {p}
                      </Text>
                    ))}
                  </View>
                ) : null}
                {e.warnings.length && !compact ? (
                  <View style={styles.problems} testID={`step-warnings-${e.page}`}>
                    {e.warnings.map((w) => (
                      <View key={w} style={styles.state}>
                        <Icon name="info" size={14} color={palette.caution} strokeWidth={2} />
                        <Text variant="small" tone="soft" style={{ flex: 1 }}>
                          {`Warning: ${w}`}
                        </Text>
                      </View>
                    ))}
                  </View>
                ) : null}
              </View>
            </Pressable>
          </Link>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.xxs },
  item: {
    flexDirection: 'row',
    gap: space.md,
    minHeight: layout.touchMinPx,
    paddingVertical: space.sm,
    paddingHorizontal: space.md,
    borderRadius: radii.md,
    borderLeftWidth: 3,
    borderLeftColor: 'transparent',
  },
  active: { backgroundColor: palette.accentSoft, borderLeftColor: palette.accent },
  // The review pages follow the wizard, set apart by a rule.
  firstReview: { marginTop: space.sm, borderTopWidth: 1, borderTopColor: palette.line, paddingTop: space.md, borderTopLeftRadius: 0, borderTopRightRadius: 0 },
  number: { width: 24, height: 24, borderRadius: 12, borderWidth: 1, borderColor: palette.lineStrong, alignItems: 'center', justifyContent: 'center', marginTop: 0 },
  numberActive: { backgroundColor: palette.accent, borderColor: palette.accent },
  numberText: { fontVariant: ['tabular-nums'] },
  body: { flex: 1, gap: space.xxs },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  state: { flexDirection: 'row', alignItems: 'center', gap: 4 },
  problems: { gap: 2 },
});
