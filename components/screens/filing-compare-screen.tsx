/**
 * /filings/[id]/compare?from=1&to=2: two versions side by side — every changed field, then the
 * results that moved because of it (screening rows, checklist items, markets, highest reported
 * SAR). A phone shows a list of changes; a wide screen two columns.
 */
import { useLocalSearchParams } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import type { ComparisonDto } from '../../constants/schemas/compare';
import { palette, space } from '../../constants/theme';
import { useCompareQuery } from '../../hooks/queries/review';
import { useIsWide } from '../../hooks/use-is-wide';
import { BackLink } from '../filings/back-link';
import { formatDb } from '../filings/format';
import { regimeShort, RESULT_LOOK, STATE_LOOK } from '../filings/labels';
import { useFilingId } from '../filings/use-filing-id';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { stepWord } from '../review/readiness-checklist';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

interface Line {
  key: string;
  label: string;
  before: string;
  after: string;
}

const STATUS_WORDS: Record<string, string> = { pass: 'Holds', fail: 'Fails', 'not-applicable': 'Does not apply' };
const resultWord = (r: { result: string; marginDb: number | null } | null) =>
  r ? `${RESULT_LOOK[r.result as keyof typeof RESULT_LOOK]?.label ?? r.result}${r.marginDb === null ? '' : ` (${formatDb(r.marginDb)})`}` : '— (no row)';
const counts = (c: { combinations: number; exempt: number; needsEvaluation: number }) => `${c.exempt} exempt, ${c.needsEvaluation} to evaluate of ${c.combinations}`;

function sections(c: ComparisonDto): { title: string; empty: string; lines: Line[]; testID: string }[] {
  return [
    {
      title: 'Changed fields',
      empty: 'No field changed.',
      testID: 'compare-fields',
      lines: c.fields.map((f, n) => ({ key: `f${n}`, label: `${stepWord(f.step)} · ${f.label}`, before: f.before ?? '— (not there)', after: f.after ?? '— (removed)' })),
    },
    {
      title: 'Screening rows that moved',
      empty: 'No screening result moved.',
      testID: 'compare-screening',
      lines: c.impact.screening.map((m) => ({
        key: `${m.transmitterId}|${m.usePositionId}|${m.regime}`,
        label: `${m.transmitterId} at ${m.usePositionId}, ${regimeShort(m.regime)}`,
        before: resultWord(m.before),
        after: resultWord(m.after),
      })),
    },
    {
      title: 'Checklist items that moved',
      empty: 'No checklist item moved.',
      testID: 'compare-checklist',
      lines: c.impact.checklist.map((i) => ({ key: i.id, label: i.title, before: STATUS_WORDS[i.before] ?? i.before, after: STATUS_WORDS[i.after] ?? i.after })),
    },
    {
      title: 'Markets',
      empty: 'No market’s counts moved.',
      testID: 'compare-markets',
      lines: c.impact.markets.map((m) => ({ key: m.regime, label: regimeShort(m.regime), before: counts(m.before), after: counts(m.after) })),
    },
    {
      title: 'Highest reported SAR',
      empty: 'No lab result moved (or none is recorded).',
      testID: 'compare-lab',
      lines: c.impact.lab.map((l) => ({
        key: `${l.regime}|${l.usePositionKind}`,
        label: `${regimeShort(l.regime)}, ${l.usePositionKind}`,
        before: l.before === null ? '—' : `${l.before.toFixed(2)} W/kg`,
        after: l.after === null ? '—' : `${l.after.toFixed(2)} W/kg`,
      })),
    },
  ];
}

export function FilingCompareScreen() {
  const id = useFilingId();
  const params = useLocalSearchParams<{ from?: string; to?: string }>();
  const to = Number(params.to ?? 0);
  const from = Number(params.from ?? to - 1);
  const query = useCompareQuery(id, from, to);
  const wide = useIsWide();
  const valid = Number.isInteger(from) && Number.isInteger(to) && from > 0 && to > 0;
  if (!valid) {
    return (
      <Screen title="Compare versions" testID="compare-screen">
        <Notice tone="caution">Say which two versions to compare, for example ?from=1&amp;to=2 (each a version number of this filing).</Notice>
        <BackLink href={`/filings/${id}`} label="Overview" />
      </Screen>
    );
  }
  if (!query.data) {
    return <Screen title="Compare versions">{query.isError ? <LoadFailed what="the comparison" error={query.error} /> : <Loading />}</Screen>;
  }
  const c = query.data;
  const all = sections(c);
  const changed = all.reduce((n, s) => n + s.lines.length, 0);
  return (
    <Screen eyebrow="Compare versions" title={`Version ${c.from.number} → version ${c.to.number}`} pageTitle={`Compare versions ${c.from.number} and ${c.to.number}`} testID="compare-screen">
      <BackLink href={`/filings/${id}`} label="Overview" />
      <Text tone="soft" testID="compare-summary">
        {changed
          ? `${c.fields.length} field${c.fields.length === 1 ? '' : 's'} changed; ${changed - c.fields.length} result${changed - c.fields.length === 1 ? '' : 's'} moved. Version ${c.from.number} is ${STATE_LOOK[c.from.state].label.toLowerCase()}, version ${c.to.number} ${STATE_LOOK[c.to.state].label.toLowerCase()}.`
          : `Nothing differs: version ${c.to.number} holds the same data as version ${c.from.number}, and no result moved.`}
      </Text>
      {all.map((s) => (
        <Card key={s.title} title={`${s.title} (${s.lines.length})`} testID={s.testID}>
          {!s.lines.length ? (
            <Text tone="muted">{s.empty}</Text>
          ) : wide ? (
            <View role="table">
              <View role="row" style={[styles.tr, styles.th]}>
                <Text variant="smallStrong" style={styles.labelCol}>
                  What
                </Text>
                <Text variant="smallStrong" style={styles.valueCol}>
                  Version {c.from.number}
                </Text>
                <Text variant="smallStrong" style={styles.valueCol}>
                  Version {c.to.number}
                </Text>
              </View>
              {s.lines.map((l) => (
                <View key={l.key} role="row" style={styles.tr}>
                  <Text variant="small" style={styles.labelCol}>
                    {l.label}
                  </Text>
                  <Text variant="small" tone="soft" style={styles.valueCol}>
                    {l.before}
                  </Text>
                  <Text variant="smallStrong" style={styles.valueCol}>
                    {l.after}
                  </Text>
                </View>
              ))}
            </View>
          ) : (
            <View role="list" style={{ gap: space.sm }}>
              {s.lines.map((l) => (
                <View key={l.key} role="listitem" style={styles.item}>
                  <Text variant="smallStrong">{l.label}</Text>
                  <Text variant="small" tone="soft">
                    Was: {l.before}
                  </Text>
                  <Text variant="small">Now: {l.after}</Text>
                </View>
              ))}
            </View>
          )}
        </Card>
      ))}
      {c.cautions.map((t) => (
        <Text key={t} variant="small" tone="muted">
          {t}
        </Text>
      ))}
    </Screen>
  );
}

const styles = StyleSheet.create({
  tr: { flexDirection: 'row', gap: space.md, paddingVertical: 6, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  th: { borderBottomColor: palette.lineStrong },
  labelCol: { flex: 2 },
  valueCol: { flex: 1.5 },
  item: { gap: 2, paddingBottom: space.xs, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
});
