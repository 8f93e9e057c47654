/** The wizard's steps with each one's completion and what is missing, in words; every step is a link. */
import { Link } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';
import { STEP_LABELS, type FilingDetail, type WizardStep } from '../../constants/schemas/filings';
import { layout, palette, radii, space } from '../../constants/theme';
import { Icon, type IconName } from '../icons';
import { Text } from '../ui/text';

/** Screening shows a table as soon as one transmitter, one use position and one market exist. */
const canScreenSome = (d: FilingDetail['data']) => d.radios.transmitters.length > 0 && d['use-positions'].usePositions.length > 0 && d.markets.markets.length > 0;

function stepLook(s: FilingDetail['steps'][number], filing: FilingDetail): { icon: IconName; color: string; word: string } {
  if (s.hasDraft) return { icon: 'warning', color: palette.fail, word: 'Unsaved changes' };
  if (s.complete) return { icon: 'check', color: palette.pass, word: 'Complete' };
  if (s.step === 'screening') {
    return canScreenSome(filing.data) ? { icon: 'pending', color: palette.caution, word: 'Partial' } : { icon: 'blocked', color: palette.inkMuted, word: 'Needs earlier steps' };
  }
  return { icon: 'pending', color: palette.caution, word: 'Incomplete' };
}

export function StepList({ filing, activeStep, compact }: { filing: FilingDetail; activeStep?: WizardStep | 'overview'; compact?: boolean }) {
  return (
    <View role="list" accessibilityLabel="Steps" style={styles.list} testID="step-list">
      {filing.steps.map((s, i) => {
        const look = stepLook(s, filing);
        const active = s.step === activeStep;
        return (
          <Link key={s.step} href={`/filings/${filing.id}/${s.step}`} asChild>
            <Pressable
              role="listitem"
              accessibilityLabel={`Step ${i + 1}: ${STEP_LABELS[s.step]}, ${look.word}`}
              aria-current={active ? 'step' : undefined}
              testID={`step-link-${s.step}`}
              style={StyleSheet.flatten([styles.item, active && styles.active])}
            >
              <View style={[styles.number, active && styles.numberActive]}>
                <Text variant="smallStrong" style={[styles.numberText, { color: active ? palette.onInk : palette.inkSoft }]}>
                  {i + 1}
                </Text>
              </View>
              <View style={styles.body}>
                <View style={styles.titleRow}>
                  <Text variant="bodyStrong" style={{ flex: 1 }}>
                    {STEP_LABELS[s.step]}
                  </Text>
                  <View style={styles.state} testID={`step-state-${s.step}`}>
                    <Icon name={look.icon} size={15} color={look.color} strokeWidth={2} />
                    <Text variant="small" style={{ color: look.color }}>
                      {look.word}
                    </Text>
                  </View>
                </View>
                {s.problems.length && !compact ? (
                  <View style={styles.problems}>
                    {s.problems.map((p) => (
                      <Text key={p} variant="small" tone="soft">
                        {p}
                      </Text>
                    ))}
                  </View>
                ) : null}
                {s.warnings?.length && !compact ? (
                  <View style={styles.problems} testID={`step-warnings-${s.step}`}>
                    {s.warnings.map((w) => (
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
  item: { flexDirection: 'row', gap: space.md, minHeight: layout.touchMinPx, paddingVertical: space.sm, paddingHorizontal: space.md, borderRadius: radii.md, borderLeftWidth: 3, borderLeftColor: 'transparent' },
  active: { backgroundColor: palette.accentSoft, borderLeftColor: palette.accent },
  number: { width: 24, height: 24, borderRadius: 12, borderWidth: 1, borderColor: palette.lineStrong, alignItems: 'center', justifyContent: 'center', marginTop: 0 },
  numberActive: { backgroundColor: palette.accent, borderColor: palette.accent },
  numberText: { fontVariant: ['tabular-nums'] },
  body: { flex: 1, gap: space.xxs },
  titleRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  state: { flexDirection: 'row', alignItems: 'center', gap: 4 },
  problems: { gap: 2 },
});
