/**
 * Step 7, Co-transmission: for each combination of transmitters that can be on together, in each
 * use position and market, the sum of the highest reported SAR (or the estimated SAR of a
 * transmitter exempt from testing) against the limit; when over, the SPLSR of each pair or
 * "needs simultaneous measurement"; for far-field positions the MPE sum of ratios. Above them, the
 * specialist's editor of which transmitters can be on together in each use position.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { CoTransmissionResult } from '../../calc/lab/lab-results';
import type { FilingDetail } from '../../constants/schemas/filings';
import { palette, radii, space } from '../../constants/theme';
import { useLabResultsQuery } from '../../hooks/queries/lab';
import { LoadFailed, Loading } from '../layout/query-states';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { ChoiceChips } from '../ui/choice-chips';
import { sourceWords } from '../source-words';
import { Notice } from '../ui/notice';
import { Sheet } from '../ui/sheet';
import { StatusBadge, type BadgeTone } from '../ui/status-badge';
import { Text } from '../ui/text';
import type { IconName } from '../icons';
import { sig } from './format';
import { DerivationBlock } from './how-computed';
import { regimeShort } from './labels';
import { CoTransmissionEditor } from './co-transmission-editor';

const OUTCOME: Record<CoTransmissionResult['outcome'], { tone: BadgeTone; icon: IconName; label: string }> = {
  'sum-within-limit': { tone: 'pass', icon: 'check', label: 'Sum within limit' },
  'splsr-within-limit': { tone: 'pass', icon: 'check', label: 'SPLSR within limit' },
  'needs-simultaneous-measurement': { tone: 'fail', icon: 'cross', label: 'Needs simultaneous measurement' },
  'over-limit': { tone: 'fail', icon: 'cross', label: 'Over limit' },
  incomplete: { tone: 'caution', icon: 'pending', label: 'Incomplete' },
};
const BASIS: Record<string, string> = { reported: 'reported', estimated: 'estimated (exempt)', ratio: 'ratio', missing: 'missing' };

export function CoTransmissionView({ filing }: { filing: FilingDetail }) {
  const lab = useLabResultsQuery(filing.id);
  const [market, setMarket] = useState('all');
  const [opened, setOpened] = useState<CoTransmissionResult | null>(null);
  if (lab.isPending) return <Loading label="Summing co-transmission…" />;
  if (lab.isError) return <LoadFailed what="the co-transmission sums" error={lab.error} onRetry={() => void lab.refetch()} />;
  const all = lab.data.coTransmission;
  const markets = [...new Set(all.map((c) => c.regime))];
  const shown = market === 'all' ? all : all.filter((c) => c.regime === market);
  return (
    <View style={styles.wrap} testID="co-transmission">
      <Card
        title="Transmitters on together"
        aside={
          <Text variant="small" tone="muted">
            Per use position: tick the transmitters that can transmit at the same time.
          </Text>
        }
        testID="cotx-groups"
      >
        <CoTransmissionEditor filing={filing} />
      </Card>
      {all.length ? (
        <Card title="Sums per use position and market">
          {markets.length > 1 ? (
            <ChoiceChips
              label="Market"
              hideLabel
              choices={[{ value: 'all', label: 'All markets' }, ...markets.map((m) => ({ value: m, label: regimeShort(m) }))]}
              value={market}
              onChange={setMarket}
              testID="cotx-market"
            />
          ) : null}
          <View role="list" style={styles.list}>
            {shown.map((c) => {
              const o = OUTCOME[c.outcome];
              const unit = c.method === 'sum-of-sar' ? ' W/kg' : '';
              return (
                <View key={c.id} role="listitem" style={styles.item} testID={`cotx-${c.id}`}>
                  <View style={styles.head}>
                    <Text variant="bodyStrong" style={{ flex: 1, minWidth: 200 }}>
                      {c.transmitterIds.join(' + ')} · {c.usePositionId} · {regimeShort(c.regime)}
                    </Text>
                    <StatusBadge tone={o.tone} icon={o.icon} label={o.label} />
                  </View>
                  <Text variant="figure">
                    {c.method === 'sum-of-sar' ? `Σ SAR (${(c.averagingMassKg ?? 0) * 1000} g)` : 'Σ ratios'} {c.sum === null ? '—' : sig(c.sum, 3)}
                    {unit} against {c.limit}
                    {unit}
                  </Text>
                  <Text variant="small" tone="soft">
                    {c.contributions.map((x) => `${x.transmitterId} ${x.value === null ? '—' : sig(x.value, 3)} (${BASIS[x.basis]})`).join(' · ')}
                  </Text>
                  {c.pairs.map((p) => (
                    <Text key={`${p.a}-${p.b}`} variant="small" tone={p.pass ? 'soft' : 'ink'}>
                      {p.a}–{p.b}: {p.reason}
                    </Text>
                  ))}
                  <Button label="How computed" variant="quiet" compact icon="info" onPress={() => setOpened(c)} testID={`cotx-how-${c.id}`} style={{ alignSelf: 'flex-start' }} />
                </View>
              );
            })}
          </View>
        </Card>
      ) : null}
      <Notice tone="caution" title="What these results are">
        <View style={{ gap: space.xxs }}>
          {lab.data.cautions.map((c) => (
            <Text key={c} variant="small">
              {sourceWords(c)}
            </Text>
          ))}
        </View>
      </Notice>
      <Sheet
        visible={!!opened}
        onClose={() => setOpened(null)}
        title="How computed: co-transmission"
        subtitle={opened ? `${opened.transmitterIds.join(' + ')} at ${opened.usePositionId}, ${regimeShort(opened.regime)}` : undefined}
        testID="cotx-how-computed"
      >
        {opened ? <DerivationBlock d={opened.derivation} /> : null}
      </Sheet>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  list: { gap: space.md },
  item: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.lg, padding: space.md, gap: space.xs, backgroundColor: palette.surface },
  head: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'flex-start' },
});
