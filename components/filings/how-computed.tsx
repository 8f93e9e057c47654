/**
 * "How computed": the tapped figure explained from the engine's own derivation, in the reader's
 * words — first the quantities behind that figure, then the formula as the standard writes it,
 * every input with its symbol, unit and where it came from, the steps between, the result, the
 * source with its edition, the notes, and every frequency of the band that was checked.
 */
import { sourceWords } from '../source-words';
import { StyleSheet, View } from 'react-native';
import type { Derivation, Quantity } from '../../calc/types';
import { USE_POSITION_LABELS } from '../../constants/schemas/device-file';
import { palette, radii, space } from '../../constants/theme';
import type { ScreeningRowDto as ScreeningRow } from '../../hooks/queries/filings';
import { Sheet } from '../ui/sheet';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { formatDb, formatMhz, formatQuantity, sig } from './format';
import { methodShort, regimeShort, RESULT_LOOK } from './labels';
import { FIGURE_QUANTITIES, quantityWords, valueWords } from './quantity-words';
import { FIGURE_LABELS, figureText, type FigureKey } from './screening-figures';

export function HowComputedSheet({ row, figure, onClose }: { row: ScreeningRow | null; figure: FigureKey; onClose: () => void }) {
  return (
    <Sheet
      visible={!!row}
      onClose={onClose}
      title={row ? `How computed: ${FIGURE_LABELS[figure].toLowerCase()}` : 'How computed'}
      subtitle={row ? `${row.transmitterId} at ${row.usePositionId} (${USE_POSITION_LABELS[row.usePositionKind].toLowerCase()}) · ${regimeShort(row.regime)}, ${row.tier}` : undefined}
      testID="how-computed"
    >
      {row ? <HowComputed row={row} figure={figure} /> : null}
    </Sheet>
  );
}

export function HowComputed({ row, figure }: { row: ScreeningRow; figure: FigureKey }) {
  const look = RESULT_LOOK[row.result];
  const d = row.derivation;
  // When no threshold applies, the engine's note says why (e.g. outside the formula's distance range).
  const why = row.marginDb === null ? d.notes.find((n) => n.startsWith('Not exempt:')) : undefined;
  return (
    <View style={styles.wrap}>
      <View style={styles.headline}>
        <Text variant="small" tone="muted">
          {FIGURE_LABELS[figure]}
        </Text>
        <Text variant="title" testID="how-computed-figure">
          {figure === 'result' ? look.label : figureText(row, figure)}
        </Text>
        {why ? (
          <Text variant="small" tone="soft" testID="how-computed-why">
            {why}
          </Text>
        ) : null}
        {row.provisionalReason ? (
          <Text variant="small" tone="soft" testID="how-computed-provisional">
            {sourceWords(row.provisionalReason)}
          </Text>
        ) : null}
        <View style={styles.badgeRow}>
          <StatusBadge tone={look.tone} icon={look.icon} label={look.label} />
          <Text variant="small" tone="soft">
            margin {formatDb(row.marginDb)} · {row.methodLabel}
          </Text>
        </View>
      </View>
      <FigureQuantities d={d} figure={figure} />
      <DerivationBlock d={d} testID="how-computed-derivation" />
      {row.ruleDerivation ? (
        <View style={styles.section}>
          <Text variant="label" tone="soft">
            The rule’s own calculation
          </Text>
          <DerivationBlock d={row.ruleDerivation} compact />
        </View>
      ) : null}
      {row.candidates.length ? (
        <View style={styles.section} testID="how-computed-candidates">
          <Text variant="label" tone="soft">
            Frequencies checked in the band
          </Text>
          <View style={styles.table}>
            <View style={[styles.tr, styles.th]}>
              <Text variant="smallStrong" tone="soft" style={[styles.c, styles.num]}>
                Frequency
              </Text>
              <Text variant="smallStrong" tone="soft" style={[styles.c, { flex: 1.6 }]}>
                Rule
              </Text>
              <Text variant="smallStrong" tone="soft" style={[styles.c, styles.num]}>
                Threshold
              </Text>
              <Text variant="smallStrong" tone="soft" style={[styles.c, styles.num]}>
                Margin
              </Text>
              <Text variant="smallStrong" tone="soft" style={[styles.c, { flex: 1.1 }]}>
                Result
              </Text>
            </View>
            {row.candidates.map((c, i) => (
              <View key={i} style={[styles.tr, c.frequencyHz === row.frequencyHz && c.marginDb === row.marginDb ? styles.worst : null]}>
                <Text variant="figure" style={[styles.c, styles.num]}>
                  {formatMhz(c.frequencyHz)}
                </Text>
                <Text variant="small" style={[styles.c, { flex: 1.6 }]}>
                  {methodShort(c.method)}
                  {c.note ? ` — ${c.note}` : ''}
                </Text>
                <Text variant="figure" style={[styles.c, styles.num]}>
                  {c.threshold === null ? '—' : `${sig(c.threshold)} ${c.thresholdUnit ?? ''}`}
                </Text>
                <Text variant="figure" style={[styles.c, styles.num]}>
                  {formatDb(c.marginDb)}
                </Text>
                <Text variant="small" style={[styles.c, { flex: 1.1 }]}>
                  {RESULT_LOOK[c.result].label}
                </Text>
              </View>
            ))}
          </View>
          <Text variant="small" tone="muted">
            The band is judged at its most restrictive frequency (highlighted): the worst result, then the smallest margin.
          </Text>
        </View>
      ) : null}
    </View>
  );
}

export function DerivationBlock({ d, compact, testID }: { d: Derivation; compact?: boolean; testID?: string }) {
  return (
    <View style={styles.wrap} testID={testID}>
      <View style={styles.section}>
        <Text variant="label" tone="soft">
          Formula
        </Text>
        <View style={styles.formula}>
          <Text variant="mono" testID={testID ? `${testID}-formula` : undefined}>
            {d.formula}
          </Text>
        </View>
      </View>
      {!compact ? <Quantities title="Inputs" values={d.inputs} /> : null}
      <Quantities title="Intermediate values" values={d.intermediate} />
      <Quantities title="Result" values={d.result} />
      <View style={styles.section}>
        <Text variant="label" tone="soft">
          Source
        </Text>
        <Text variant="bodyStrong" testID={testID ? `${testID}-source` : undefined}>
          {sourceWords(d.source)}
        </Text>
      </View>
      {d.notes.length && !compact ? (
        <View style={styles.section}>
          <Text variant="label" tone="soft">
            Notes
          </Text>
          {d.notes.map((n, i) => (
            <Text key={i} variant="small" tone="soft">
              • {sourceWords(n)}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** The quantities behind the tapped figure, gathered from wherever the derivation lists them. */
function FigureQuantities({ d, figure }: { d: Derivation; figure: FigureKey }) {
  const all: Record<string, Quantity> = { ...d.inputs, ...d.intermediate, ...d.result };
  const picked = Object.fromEntries((FIGURE_QUANTITIES[figure] ?? []).filter((k) => k in all).map((k) => [k, all[k]!]));
  return <Quantities title={`Behind the ${FIGURE_LABELS[figure].toLowerCase()}`} values={picked} testID="how-computed-figure-quantities" />;
}

function Quantities({ title, values, testID }: { title: string; values: Record<string, Quantity>; testID?: string }) {
  const entries = Object.entries(values);
  if (!entries.length) return null;
  return (
    <View style={styles.section} testID={testID}>
      <Text variant="label" tone="soft">
        {title}
      </Text>
      <View style={styles.table}>
        {entries.map(([name, q]) => {
          const words = quantityWords(name);
          const text = valueWords(name, q.value) ?? formatQuantity(q.value, q.unit);
          const long = text.length > 40;
          return (
            <View key={name} style={[styles.tr, long && styles.trLong]}>
              <View style={[styles.c, styles.name]}>
                <Text variant="small">
                  {words.label}
                  {words.symbol ? <Text variant="small" tone="muted">{`  ${words.symbol}`}</Text> : null}
                </Text>
                {words.origin ? (
                  <Text variant="small" tone="muted">
                    {words.origin}
                  </Text>
                ) : null}
              </View>
              <Text variant={typeof q.value === 'number' ? 'figure' : 'small'} style={[styles.c, long ? styles.longValue : styles.value]}>
                {text}
              </Text>
            </View>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  headline: { gap: space.xs, paddingBottom: space.sm, borderBottomWidth: 1, borderBottomColor: palette.line },
  badgeRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  section: { gap: space.xs },
  formula: { backgroundColor: palette.paper, borderRadius: radii.md, padding: space.md, borderWidth: 1, borderColor: palette.line },
  table: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.md, overflow: 'hidden' },
  tr: { flexDirection: 'row', gap: space.sm, paddingHorizontal: space.sm, paddingVertical: 6, borderBottomWidth: 1, borderBottomColor: palette.paperDeep, alignItems: 'baseline' },
  trLong: { flexDirection: 'column', alignItems: 'stretch', gap: 2 },
  th: { backgroundColor: palette.paper },
  worst: { backgroundColor: palette.accentSoft },
  c: { minWidth: 0 },
  num: { flex: 1, textAlign: 'right' },
  name: { flex: 1.4, gap: 1 },
  value: { flex: 1, textAlign: 'right' },
  longValue: { textAlign: 'left' },
});
