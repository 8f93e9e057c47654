/**
 * Step 5, Screening: per market how many combinations are exempt or need SAR / MPE evaluation,
 * the table of every transmitter × use position × market (a card list on a phone) where every
 * figure opens its "how computed" panel, the SAR-against-depth estimate, and the cautions.
 * At scale: filters by result, market, transmitter and use position (a summary count sets them
 * with one tap), rows drawn a page at a time so the first ones appear at once, or one collapsed
 * card per transmitter with its worst result, and the table (as filtered) downloads as CSV.
 */
import { sourceWords } from '../source-words';
import { useState } from 'react';
import { Platform, Pressable, StyleSheet, View } from 'react-native';
import type { ScreeningCounts } from '../../calc/screening/screen';
import { REGIME_LABELS, USE_POSITION_LABELS, type MarketRegime } from '../../constants/schemas/device-file';
import type { FilingDetail } from '../../constants/schemas/filings';
import { layout, palette, radii, space } from '../../constants/theme';
import { useScreeningQuery, type FilingScreening, type ScreeningRowDto } from '../../hooks/queries/filings';
import { useIsWide } from '../../hooks/use-is-wide';
import { formatDateTime } from '../format';
import { Icon } from '../icons';
import { LoadFailed, Loading } from '../layout/query-states';
import { SkipLink } from '../layout/skip-link';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { ChoiceChips } from '../ui/choice-chips';
import { SelectField } from '../ui/select-field';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { DepthSection } from './depth-section';
import { formatDb, formatMhz, formatMm } from './format';
import { HowComputedSheet } from './how-computed';
import { methodShort, powerModeText, regimeShort, RESULT_LOOK } from './labels';
import { evaluatedText, thresholdText, type FigureKey } from './screening-figures';
import { ALL, filterRows, groupByTransmitter, isFiltered, NO_FILTER, screeningCsv, type ScreeningFilter, type TransmitterGroup } from './screening-filter';

/** Rows drawn at first and with each "show more": enough to fill a wide screen, few enough to appear at once on a phone. */
export const ROWS_PAGE = 40;

type Opened = { row: ScreeningRowDto; figure: FigureKey } | null;
type Layout = 'rows' | 'transmitters';

export function ScreeningView({ filing }: { filing: FilingDetail }) {
  const screening = useScreeningQuery(filing.id);
  const [filter, setFilter] = useState<ScreeningFilter>(NO_FILTER);
  const [shown, setShown] = useState(ROWS_PAGE);
  const [opened, setOpened] = useState<Opened>(null);
  const [layoutBy, setLayoutBy] = useState<Layout>('rows');
  const refine = (next: Partial<ScreeningFilter>) => {
    setFilter((f) => ({ ...f, ...next }));
    setShown(ROWS_PAGE);
  };
  // A failed refetch (a 401 while the sign-in sheet is up) keeps the table that was shown.
  if (!screening.data) {
    if (screening.isError) return <LoadFailed what="the screening" error={screening.error} onRetry={() => void screening.refetch()} />;
    return <Loading label="Screening every combination…" />;
  }
  const s = screening.data;
  const regimes = Object.keys(s.summary.byRegime);
  const rows = filterRows(s.rows, filter);
  const transmitterIds = [...new Set(s.rows.map((r) => r.transmitterId))];
  const positionIds = [...new Set(s.rows.map((r) => r.usePositionId))];
  const open = (row: ScreeningRowDto, figure: FigureKey) => setOpened({ row, figure });
  return (
    <View style={styles.wrap} testID="screening">
      {!s.complete ? (
        <Notice tone="caution" title="Some steps are incomplete" testID="screening-incomplete">
          The table covers what has been entered so far. Complete every step for a full screening.
        </Notice>
      ) : null}
      <Summary s={s} onPick={(regime, result) => refine({ regime, result, transmitterId: ALL, usePositionId: ALL })} active={filter} />
      {s.gaps.length ? (
        <Notice tone="caution" title={`${s.gaps.length} combination${s.gaps.length === 1 ? '' : 's'} could not be screened`} testID="screening-gaps">
          <View style={{ gap: 2 }}>
            {s.gaps.map((g) => (
              <Text key={`${g.transmitterId}-${g.usePositionId}`} variant="small">
                {g.message}
              </Text>
            ))}
          </View>
        </Notice>
      ) : null}
      {s.conditions?.length ? (
        <Notice tone="caution" title="Closer than a module’s grant allows" testID="screening-module-conditions">
          <View style={{ gap: 2 }}>
            {s.conditions.map((c) => (
              <Text key={`${c.transmitterId}-${c.usePositionId}-${c.antennaId}`} variant="small">
                {c.message}
              </Text>
            ))}
            <Text variant="small" tone="muted">{`Source: ${sourceWords(s.conditions[0].source)}.`}</Text>
          </View>
        </Notice>
      ) : null}
      <Card
        title="Every combination"
        aside={
          <Text variant="small" tone="muted">
            Tap a figure to see how it was computed.
          </Text>
        }
      >
        <View style={styles.filters} testID="screening-filters">
          {regimes.length > 1 ? (
            <ChoiceChips
              label="Market"
              choices={[{ value: ALL, label: 'All markets' }, ...regimes.map((r) => ({ value: r, label: regimeShort(r) }))]}
              value={filter.regime}
              onChange={(regime) => refine({ regime })}
              testID="screening-market"
            />
          ) : null}
          <ChoiceChips
            label="Result"
            choices={[{ value: ALL, label: 'Any result' }, ...(['exempt', 'evaluate-sar', 'evaluate-mpe'] as const).map((r) => ({ value: r, label: RESULT_LOOK[r].label }))]}
            value={filter.result}
            onChange={(result) => refine({ result: result as ScreeningFilter['result'] })}
            testID="screening-result"
          />
          <View style={styles.selects}>
            <View style={styles.select}>
              <SelectField
                label="Transmitter"
                options={[{ value: ALL, label: 'Every transmitter' }, ...transmitterIds.map((t) => ({ value: t, label: t }))]}
                value={filter.transmitterId}
                onChange={(transmitterId) => refine({ transmitterId })}
                testID="screening-transmitter"
              />
            </View>
            <View style={styles.select}>
              <SelectField
                label="Use position"
                options={[{ value: ALL, label: 'Every use position' }, ...positionIds.map((p) => ({ value: p, label: p }))]}
                value={filter.usePositionId}
                onChange={(usePositionId) => refine({ usePositionId })}
                testID="screening-position"
              />
            </View>
          </View>
          <ChoiceChips
            label="Show"
            choices={[
              { value: 'rows', label: 'Every combination' },
              { value: 'transmitters', label: 'By transmitter' },
            ]}
            value={layoutBy}
            onChange={(v) => setLayoutBy(v as Layout)}
            testID="screening-layout"
          />
          <View style={styles.filterBar}>
            <Text variant="small" tone="soft" testID="screening-shown" accessibilityLiveRegion="polite">
              {isFiltered(filter) ? `${rows.length} of ${s.rows.length} combinations match` : `${s.rows.length} combinations`}
            </Text>
            {isFiltered(filter) ? <Button label="Clear filters" variant="quiet" compact onPress={() => refine(NO_FILTER)} testID="screening-clear" /> : null}
            {Platform.OS === 'web' && rows.length ? (
              <Button label="Download CSV" variant="secondary" compact icon="link" onPress={() => downloadCsv(rows, filing.device.name)} testID="screening-csv" />
            ) : null}
          </View>
        </View>
        {/* Keyboard users need not tab through every figure of a long table to reach what follows it. */}
        {rows.length > 1 ? <SkipLink targetId="after-screening-table" label="Skip past the table" testID="skip-screening-table" /> : null}
        {s.rows.length === 0 ? (
          <Text tone="muted">Nothing to screen yet: add transmitters, use positions with separations, and at least one market.</Text>
        ) : rows.length === 0 ? (
          <Text tone="muted">No combination matches these filters.</Text>
        ) : layoutBy === 'transmitters' ? (
          <TransmitterGroups groups={groupByTransmitter(rows)} onOpen={open} />
        ) : (
          <>
            <ScreeningRows rows={rows.slice(0, shown)} onOpen={open} />
            {rows.length > shown ? (
              <Button
                label={`Show ${Math.min(ROWS_PAGE, rows.length - shown)} more (${rows.length - shown} not shown)`}
                variant="secondary"
                onPress={() => setShown((n) => n + ROWS_PAGE)}
                testID="screening-more"
                style={{ alignSelf: 'flex-start' }}
              />
            ) : null}
          </>
        )}
        <View nativeID="after-screening-table" />
      </Card>
      {filing.data.radios.transmitters.length && filing.data['use-positions'].usePositions.length ? <DepthSection filing={filing} initial={s.rows[0] ?? null} /> : null}
      <Notice tone="caution" title="What these results are" testID="screening-cautions">
        <View style={{ gap: space.xxs }}>
          {s.cautions.map((c) => (
            <Text key={c} variant="small">
              {sourceWords(c)}
            </Text>
          ))}
        </View>
      </Notice>
      <Text variant="small" tone="muted" testID="screening-versions">
        Engine {s.engineVersion} · rule set {s.ruleSetVersion} · computed {formatDateTime(s.computedAt)} for version {s.version}
      </Text>
      <HowComputedSheet row={opened?.row ?? null} figure={opened?.figure ?? 'result'} onClose={() => setOpened(null)} />
    </View>
  );
}

/** Web: the filtered table as a CSV file named after the device. */
function downloadCsv(rows: ScreeningRowDto[], deviceName: string) {
  if (typeof document === 'undefined') return;
  const url = URL.createObjectURL(new Blob([screeningCsv(rows)], { type: 'text/csv;charset=utf-8' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = `${deviceName.replace(/[^\w.-]+/g, '-').replace(/^-|-$/g, '') || 'filing'}-screening.csv`;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

function Summary({ s, onPick, active }: { s: FilingScreening; onPick: (regime: string, result: ScreeningFilter['result']) => void; active: ScreeningFilter }) {
  const wide = useIsWide();
  const entries = Object.entries(s.summary.byRegime) as [MarketRegime, ScreeningCounts][];
  if (!entries.length)
    return (
      <Notice tone="caution" title="No markets chosen">
        Pick at least one market under Markets to screen against it.
      </Notice>
    );
  return (
    <View style={[styles.summary, wide && styles.summaryWide]} testID="screening-summary">
      {entries.map(([regime, c]) => (
        <View
          key={regime}
          style={[styles.summaryCard, wide && styles.summaryCardWide]}
          testID={`summary-${regime}`}
          accessibilityLabel={`${REGIME_LABELS[regime]}: ${c.combinations} combinations, ${c.exempt} exempt, ${c.evaluateSar} need SAR, ${c.evaluateMpe} need MPE`}
        >
          <Text variant="label" tone="accent">
            {regimeShort(regime)}
          </Text>
          <Text variant="small" tone="soft" numberOfLines={2}>
            {REGIME_LABELS[regime]}
          </Text>
          <View style={styles.counts}>
            {(
              [
                ['Combinations', c.combinations, ALL, undefined, palette.ink],
                ['Exempt', c.exempt, 'exempt', 'check', palette.pass],
                ['Needs SAR', c.evaluateSar, 'evaluate-sar', 'warning', c.evaluateSar ? palette.caution : palette.inkMuted],
                ['Needs MPE', c.evaluateMpe, 'evaluate-mpe', 'warning', c.evaluateMpe ? palette.caution : palette.inkMuted],
              ] as const
            ).map(([label, n, result, icon, color]) => (
              <Count
                key={label}
                label={label}
                n={n}
                icon={icon}
                color={color}
                selected={active.regime === regime && active.result === result}
                onPress={() => onPick(regime, result)}
                testID={`summary-${regime}-${result}`}
                a11y={`Show ${label.toLowerCase()} for ${regimeShort(regime)}: ${n}`}
              />
            ))}
          </View>
        </View>
      ))}
    </View>
  );
}

function Count({
  label,
  n,
  icon,
  color = palette.ink,
  selected,
  onPress,
  testID,
  a11y,
}: {
  label: string;
  n: number;
  icon?: 'check' | 'warning';
  color?: string;
  selected: boolean;
  onPress: () => void;
  testID: string;
  a11y: string;
}) {
  return (
    <Pressable
      style={({ pressed }) => [styles.count, selected && styles.countOn, pressed && styles.pressed]}
      onPress={onPress}
      accessibilityRole="button"
      accessibilityLabel={a11y}
      aria-pressed={selected}
      testID={testID}
    >
      <Text variant="title" style={{ color, fontVariant: ['tabular-nums'] }}>
        {n}
      </Text>
      <View style={styles.countLabel}>
        {icon ? <Icon name={icon} size={13} color={color} strokeWidth={2} /> : null}
        <Text variant="small" tone="soft">
          {label}
        </Text>
      </View>
    </Pressable>
  );
}

const COLUMNS: { key: FigureKey | 'tx' | 'pos' | 'market'; label: string; flex: number; numeric?: boolean }[] = [
  { key: 'tx', label: 'Transmitter', flex: 1.2 },
  { key: 'pos', label: 'Use position', flex: 1.1 },
  { key: 'market', label: 'Market', flex: 0.85 },
  { key: 'method', label: 'Method', flex: 1.3 },
  { key: 'frequency', label: 'Frequency', flex: 1.05, numeric: true },
  { key: 'evaluated', label: 'Evaluated', flex: 1.05, numeric: true },
  { key: 'threshold', label: 'Threshold', flex: 1.1, numeric: true },
  { key: 'result', label: 'Result', flex: 1.55 },
  { key: 'margin', label: 'Margin', flex: 1.05, numeric: true },
];

const COUNT_WORDS: Record<ScreeningRowDto['result'], (n: number) => string> = {
  'evaluate-sar': (n) => (n === 1 ? 'needs SAR' : 'need SAR'),
  'evaluate-mpe': (n) => (n === 1 ? 'needs MPE' : 'need MPE'),
  exempt: () => 'exempt',
};

/** One collapsed card per transmitter: its worst result and counts; opened, its rows (position × market). */
function TransmitterGroups({ groups, onOpen }: { groups: TransmitterGroup[]; onOpen: (row: ScreeningRowDto, figure: FigureKey) => void }) {
  const [openIds, setOpenIds] = useState<ReadonlySet<string>>(new Set());
  const toggle = (id: string) =>
    setOpenIds((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  return (
    <View style={styles.cards} role="list" testID="screening-groups">
      {groups.map((g, gi) => {
        const isOpen = openIds.has(g.transmitterId);
        const counts = (['evaluate-sar', 'evaluate-mpe', 'exempt'] as const)
          .filter((r) => g.counts[r])
          .map((r) => `${g.counts[r]} ${COUNT_WORDS[r](g.counts[r])}`)
          .join(' · ');
        const w = g.worst;
        return (
          <View key={g.transmitterId} style={styles.group} role="listitem" testID={`screening-group-${gi}`}>
            <Pressable
              onPress={() => toggle(g.transmitterId)}
              accessibilityRole="button"
              aria-expanded={isOpen}
              accessibilityLabel={`${g.transmitterId}: ${g.rows.length} combinations, worst ${RESULT_LOOK[w.result].label}${w.provisional ? ' (provisional)' : ''} at ${w.usePositionId}, ${regimeShort(w.regime)}. ${isOpen ? 'Hide' : 'Show'} its rows`}
              style={({ pressed }) => [styles.groupHead, pressed && styles.pressed]}
              testID={`screening-group-${gi}-toggle`}
            >
              <Icon name={isOpen ? 'chevronDown' : 'chevronRight'} size={16} color={palette.inkSoft} strokeWidth={2} />
              <View style={{ flex: 1, gap: 2, minWidth: 0 }}>
                <Text variant="bodyStrong">{g.transmitterId}</Text>
                <Text variant="small" tone="soft" testID={`screening-group-${gi}-counts`}>
                  {`${g.rows.length} combination${g.rows.length === 1 ? '' : 's'} · ${counts}`}
                </Text>
                <Text variant="small" tone="muted" testID={`screening-group-${gi}-worst`}>
                  {`Worst: ${w.usePositionId} · ${regimeShort(w.regime)}, margin ${formatDb(w.marginDb)}`}
                </Text>
              </View>
              <ResultBadge row={w} />
            </Pressable>
            {isOpen ? <ScreeningRows rows={g.rows} onOpen={onOpen} idPrefix={`g${gi}-`} /> : null}
          </View>
        );
      })}
    </View>
  );
}

function ScreeningRows({ rows, onOpen, idPrefix = '' }: { rows: ScreeningRowDto[]; onOpen: (row: ScreeningRowDto, figure: FigureKey) => void; idPrefix?: string }) {
  const wide = useIsWide();
  if (!wide) {
    return (
      <View style={styles.cards} role="list" testID={`${idPrefix}screening-cards`}>
        {rows.map((row, i) => (
          <RowCard key={i} row={row} index={i} onOpen={onOpen} idPrefix={idPrefix} />
        ))}
      </View>
    );
  }
  return (
    <View style={styles.table} role="table" testID={`${idPrefix}screening-table`}>
      <View style={[styles.tr, styles.th]} role="row">
        {/* Every cell, heading or figure, is a View with the column's flex: a Text with flex sizes from its content, which set headings up to 14 px off their columns. */}
        {COLUMNS.map((c) => (
          <View key={c.key} role="columnheader" style={[styles.td, { flex: c.flex }]}>
            <Text variant="smallStrong" tone="soft" style={[styles.thCell, c.numeric && styles.right]}>
              {c.label}
            </Text>
          </View>
        ))}
      </View>
      {rows.map((row, i) => (
        <View key={i} style={[styles.tr, i % 2 === 1 && styles.zebra]} role="row" testID={`${idPrefix}screening-row-${i}`}>
          <View role="cell" style={[styles.td, { flex: COLUMNS[0]!.flex }]}>
            <Text variant="smallStrong" style={styles.cellPad}>
              {row.transmitterId}
              {reduced(row) ? (
                <Text variant="small" tone="muted" testID={`${idPrefix}cell-${i}-power-mode`}>
                  {`\n${powerModeText(row.powerMode)}`}
                </Text>
              ) : null}
            </Text>
          </View>
          <View role="cell" style={[styles.td, { flex: COLUMNS[1]!.flex }]}>
            <Text variant="small" style={styles.cellPad}>
              {row.usePositionId}
              {'\n'}
              <Text variant="small" tone="muted">
                {antennaText(row)}
              </Text>
            </Text>
          </View>
          <View role="cell" style={[styles.td, { flex: COLUMNS[2]!.flex }]}>
            <Text variant="small" style={styles.cellPad}>
              {regimeShort(row.regime)}
            </Text>
          </View>
          <Figure flex={1.3} label={methodShort(row.method)} onPress={() => onOpen(row, 'method')} testID={`${idPrefix}cell-${i}-method`} />
          <Figure flex={1.05} numeric label={formatMhz(row.frequencyHz)} onPress={() => onOpen(row, 'frequency')} testID={`${idPrefix}cell-${i}-frequency`} />
          <Figure flex={1.05} numeric label={evaluatedText(row)} onPress={() => onOpen(row, 'evaluated')} testID={`${idPrefix}cell-${i}-evaluated`} />
          <Figure flex={1.1} numeric label={thresholdText(row)} onPress={() => onOpen(row, 'threshold')} testID={`${idPrefix}cell-${i}-threshold`} />
          <View role="cell" style={[styles.td, { flex: 1.55 }]}>
            <Pressable
              style={({ pressed }) => [styles.cellPress, { flex: 1 }, pressed && styles.pressed]}
              onPress={() => onOpen(row, 'result')}
              accessibilityRole="button"
              accessibilityLabel={`How computed: result ${RESULT_LOOK[row.result].label}`}
              testID={`${idPrefix}cell-${i}-result`}
            >
              <ResultBadge row={row} />
            </Pressable>
          </View>
          <Figure flex={1.05} numeric label={formatDb(row.marginDb)} onPress={() => onOpen(row, 'margin')} testID={`${idPrefix}cell-${i}-margin`} />
        </View>
      ))}
    </View>
  );
}

/** Rows at a reduced power say so; full power (the usual case) goes unsaid. */
const reduced = (row: ScreeningRowDto) => !!row.powerMode && row.powerMode !== 'full';

/** The antenna the row was evaluated at and its separation; "least favourable of N" when the transmitter has several. */
function antennaText(row: ScreeningRowDto): string {
  if (!row.antennaId) return formatMm(row.separationM);
  const of = row.antennaCount > 1 ? ` (least favourable of ${row.antennaCount})` : '';
  return `${row.antennaId}${of} at ${formatMm(row.separationM)}`;
}

function ResultBadge({ row }: { row: ScreeningRowDto }) {
  const look = RESULT_LOOK[row.result];
  // An exemption on a superseded rule set (ISED on RSS-102 Issue 5) is provisional: said in words.
  if (row.provisional) return <StatusBadge tone="caution" icon="info" label={`${look.label} (provisional)`} />;
  return <StatusBadge tone={look.tone} icon={look.icon} label={look.label} />;
}

function Figure({ label, onPress, flex, numeric, testID }: { label: string; onPress: () => void; flex: number; numeric?: boolean; testID: string }) {
  // The row's children must be cells (ARIA table); the button sits inside its cell.
  return (
    <View role="cell" style={[styles.td, { flex }]}>
      <Pressable
        onPress={onPress}
        accessibilityRole="button"
        accessibilityLabel={`How computed: ${label}`}
        testID={testID}
        style={({ pressed }) => [styles.cellPress, { flex: 1 }, pressed && styles.pressed]}
      >
        <Text variant={numeric ? 'figure' : 'small'} style={[numeric ? styles.figure : styles.link]}>
          {label}
        </Text>
      </Pressable>
    </View>
  );
}

function RowCard({ row, index, onOpen, idPrefix }: { row: ScreeningRowDto; index: number; onOpen: (row: ScreeningRowDto, figure: FigureKey) => void; idPrefix: string }) {
  const items: { key: FigureKey; label: string; value: string }[] = [
    { key: 'frequency', label: 'Frequency', value: formatMhz(row.frequencyHz) },
    { key: 'evaluated', label: 'Evaluated', value: evaluatedText(row) },
    { key: 'threshold', label: 'Threshold', value: thresholdText(row) },
    { key: 'margin', label: 'Margin', value: formatDb(row.marginDb) },
  ];
  return (
    <View style={styles.card} role="listitem" testID={`${idPrefix}screening-row-${index}`}>
      <View style={styles.cardHead}>
        <View style={{ flex: 1, gap: 2 }}>
          <Text variant="bodyStrong">
            {row.transmitterId} · {regimeShort(row.regime)}
          </Text>
          <Text variant="small" tone="soft">
            {row.usePositionId} — {USE_POSITION_LABELS[row.usePositionKind].toLowerCase()}, {antennaText(row)}
          </Text>
          {reduced(row) ? (
            <Text variant="small" tone="soft" testID={`${idPrefix}cell-${index}-power-mode`}>
              {powerModeText(row.powerMode)}
            </Text>
          ) : null}
        </View>
        <ResultBadge row={row} />
      </View>
      <Pressable
        onPress={() => onOpen(row, 'method')}
        style={({ pressed }) => [styles.methodRow, pressed && styles.pressed]}
        accessibilityRole="button"
        accessibilityLabel={`How computed: method ${row.methodLabel}`}
        testID={`${idPrefix}cell-${index}-method`}
      >
        <Text variant="small" tone="soft" style={{ flex: 1 }}>
          {row.methodLabel}
        </Text>
      </Pressable>
      <View style={styles.cardFigures}>
        {items.map((it) => (
          <Pressable
            key={it.key}
            onPress={() => onOpen(row, it.key)}
            style={({ pressed }) => [styles.cardFigure, pressed && styles.pressed]}
            accessibilityRole="button"
            accessibilityLabel={`How computed: ${it.label} ${it.value}`}
            testID={`${idPrefix}cell-${index}-${it.key}`}
          >
            <Text variant="small" tone="muted">
              {it.label}
            </Text>
            <Text variant="figure" style={styles.figure}>
              {it.value}
            </Text>
          </Pressable>
        ))}
      </View>
      <Button label="How computed" variant="quiet" compact icon="info" onPress={() => onOpen(row, 'result')} testID={`${idPrefix}how-${index}`} style={{ alignSelf: 'flex-start' }} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  summary: { gap: space.md },
  summaryWide: { flexDirection: 'row', flexWrap: 'wrap' },
  // A basis only side by side: in the phone's column it would set the card's height.
  summaryCardWide: { flexGrow: 1, flexBasis: 300 },
  summaryCard: { minWidth: 0, backgroundColor: palette.surface, borderWidth: 1, borderColor: palette.line, borderRadius: radii.lg, padding: space.lg, gap: space.xs },
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, paddingTop: space.xs },
  count: {
    gap: 0,
    flexGrow: 1,
    flexBasis: 88,
    minWidth: 0,
    minHeight: layout.touchMinPx,
    paddingHorizontal: space.xs,
    paddingVertical: 2,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: 'transparent',
  },
  countOn: { borderColor: palette.accent, backgroundColor: palette.accentSoft },
  filters: { gap: space.md },
  selects: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  select: { flexGrow: 1, flexBasis: 200 },
  filterBar: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  cellPad: { paddingHorizontal: 4 },
  countLabel: { flexDirection: 'row', alignItems: 'center', gap: 3 },
  table: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.md, overflow: 'hidden' },
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingHorizontal: space.sm, minHeight: layout.touchMinPx, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  th: { backgroundColor: palette.paper, minHeight: 36 },
  zebra: { backgroundColor: '#FBFAF7' },
  td: { minWidth: 0, paddingVertical: space.xs },
  right: { textAlign: 'right' },
  thCell: { paddingHorizontal: 4 },
  cellPress: { minHeight: layout.touchMinPx, justifyContent: 'center', borderRadius: radii.sm, paddingHorizontal: 4 },
  pressed: { backgroundColor: palette.accentSoft },
  figure: { fontSize: 13, textAlign: 'right', textDecorationLine: 'underline', textDecorationStyle: 'dotted', textDecorationColor: palette.inkFaint } as object,
  link: { textDecorationLine: 'underline', textDecorationStyle: 'dotted', textDecorationColor: palette.inkFaint } as object,
  cards: { gap: space.md },
  group: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.lg, backgroundColor: palette.surface, padding: space.xs, gap: space.sm },
  groupHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: layout.touchMinPx, padding: space.sm, borderRadius: radii.md },
  card: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.lg, padding: space.md, gap: space.sm, backgroundColor: palette.surface },
  cardHead: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start' },
  methodRow: { minHeight: 32, justifyContent: 'center', borderRadius: radii.sm },
  cardFigures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  cardFigure: { flexBasis: '47%', flexGrow: 1, minHeight: layout.touchMinPx, paddingVertical: space.xs, paddingHorizontal: space.sm, borderRadius: radii.md, backgroundColor: palette.paper, gap: 0 },
});
