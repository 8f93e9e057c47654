/**
 * Step 6, Measurements: the highest reported SAR per market and exposure condition first (the
 * table a reviewer reads first), the import of the lab's spreadsheet, every measurement scaled to
 * its tune-up limit with its flags (cards on a phone, a table on a wide screen), and the
 * measurement checks — liquid, system check, drift, instruments, uncertainty, coverage — each
 * with an icon and a word, its tolerance, its source and how to fix it.
 */
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { CheckKind, HighestReported, LabCheck, LabRow } from '../../calc/lab/lab-results';
import { USE_POSITION_LABELS } from '../../constants/schemas/device-file';
import { EDITABLE_STATES, type FilingDetail } from '../../constants/schemas/filings';
import { layout, palette, radii, space } from '../../constants/theme';
import { useLabResultsQuery, type FilingLabResults } from '../../hooks/queries/lab';
import { hasRole, useCurrentUser } from '../../hooks/queries/session';
import { useIsWide } from '../../hooks/use-is-wide';
import { formatDateTime } from '../format';
import { LoadFailed, Loading } from '../layout/query-states';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { ChoiceChips } from '../ui/choice-chips';
import { Notice } from '../ui/notice';
import { Sheet } from '../ui/sheet';
import { StatusBadge, type BadgeTone } from '../ui/status-badge';
import { Text } from '../ui/text';
import type { IconName } from '../icons';
import { formatDb, formatMhz, sig } from './format';
import { DerivationBlock } from './how-computed';
import { regimeShort } from './labels';
import { MeasurementImport } from './measurement-import';
import { LabDataEditor } from './lab-data-editor';
import { sourceWords } from '../source-words';
import {
  ALL,
  DEFAULT_LAB_SORT,
  FLAGGED,
  NO_FLAGS,
  NO_LAB_FILTER,
  filterLabRows,
  flagsFor,
  flaggedKinds,
  isLabFiltered,
  marginFor,
  sortLabRows,
  type LabFilter,
  type LabSort,
  type LabSortKey,
} from './lab-filter';

export const CHECK_LOOK: Record<LabCheck['status'], { icon: IconName; tone: BadgeTone; label: string }> = {
  pass: { icon: 'check', tone: 'pass', label: 'In tolerance' },
  warning: { icon: 'warning', tone: 'caution', label: 'Check' },
  fail: { icon: 'cross', tone: 'fail', label: 'Out of tolerance' },
};
const FAIL_WORD: Partial<Record<CheckKind, string>> = {
  limit: 'Over limit',
  power: 'Above tune-up',
  coverage: 'Missing',
  repeats: 'Repeat needed',
  band: 'Not in band',
  separation: 'Too far',
  'co-transmission': 'Needs attention',
  uncertainty: 'Needed',
  calibration: 'Not calibrated',
};
export const checkLabel = (c: LabCheck) =>
  c.status === 'fail' ? (FAIL_WORD[c.kind] ?? CHECK_LOOK.fail.label) : c.status === 'pass' ? (c.kind === 'coverage' ? 'Measured' : CHECK_LOOK.pass.label) : CHECK_LOOK.warning.label;

const KIND_TITLES: { kinds: CheckKind[]; title: string }[] = [
  { kinds: ['liquid', 'liquid-temperature'], title: 'Liquid checks' },
  { kinds: ['system-check'], title: 'System checks' },
  { kinds: ['drift'], title: 'Power drift' },
  { kinds: ['calibration'], title: 'Instruments' },
  { kinds: ['uncertainty'], title: 'Uncertainty budget' },
  { kinds: ['repeats'], title: 'Repeated measurements' },
  { kinds: ['coverage'], title: 'Coverage of what screening sends to SAR' },
  { kinds: ['power', 'limit', 'separation', 'band', 'mass'], title: 'Per measurement' },
];

const sar = (x: number | null) => (x === null ? '—' : `${sig(x, 3)} W/kg`);
/** In the wide table the unit is under the heading. */
const sarFigure = (x: number | null) => (x === null ? '—' : sig(x, 3));
const CONDITION_LABEL = (k: string) => USE_POSITION_LABELS[k as keyof typeof USE_POSITION_LABELS] ?? k;

type Opened = { kind: 'row'; row: LabRow } | { kind: 'check'; check: LabCheck } | null;

export function LabView({ filing }: { filing: FilingDetail }) {
  const lab = useLabResultsQuery(filing.id);
  const user = useCurrentUser();
  const [opened, setOpened] = useState<Opened>(null);
  // `filing.editable` is the specialist's right; lab data is the engineer's, in an editable version.
  const canImport = hasRole(user, 'engineer') && EDITABLE_STATES.includes(filing.version.state) && !filing.archivedAt;
  if (lab.isPending) return <Loading label="Scaling every measurement…" />;
  if (lab.isError) return <LoadFailed what="the lab results" error={lab.error} onRetry={() => void lab.refetch()} />;
  const r = lab.data;
  return (
    <View style={styles.wrap} testID="lab-results">
      <HighestTable r={r} onOpen={(row) => setOpened({ kind: 'row', row })} />
      {canImport ? (
        <Card title="Import the lab’s measurements">
          <MeasurementImport filingId={filing.id} />
        </Card>
      ) : null}
      <Card
        title={canImport ? 'Enter or edit by hand' : 'The lab’s data'}
        aside={
          <Text variant="small" tone="muted">
            {canImport ? 'Each table saves whole; the results recompute.' : 'Read only: the test engineer enters the lab’s data.'}
          </Text>
        }
        testID="lab-data-card"
      >
        <LabDataEditor filing={filing} editable={canImport} />
      </Card>
      <Measurements r={r} onOpen={(row) => setOpened({ kind: 'row', row })} />
      <Checks r={r} onOpen={(check) => setOpened({ kind: 'check', check })} />
      <Notice tone="caution" title="What these results are" testID="lab-cautions">
        <View style={{ gap: space.xxs }}>
          {r.cautions.map((c) => (
            <Text key={c} variant="small">
              {sourceWords(c)}
            </Text>
          ))}
        </View>
      </Notice>
      <Text variant="small" tone="muted" testID="lab-versions">
        Engine {r.engineVersion} · rule set {r.ruleSetVersion} · computed {formatDateTime(r.computedAt)} for version {r.version}
      </Text>
      <Sheet
        visible={!!opened}
        onClose={() => setOpened(null)}
        title={opened?.kind === 'row' ? `How computed: ${opened.row.measurementId}` : opened?.kind === 'check' ? `Check: ${opened.check.subject.id}` : 'How computed'}
        subtitle={opened?.kind === 'row' ? `${opened.row.transmitterId} at ${opened.row.usePositionId} · ${opened.row.testPosition || 'test position not given'}` : undefined}
        testID="lab-how-computed"
      >
        {opened?.kind === 'row' ? <RowDetail row={opened.row} /> : opened?.kind === 'check' ? <CheckItem check={opened.check} /> : null}
      </Sheet>
    </View>
  );
}

function HighestTable({ r, onOpen }: { r: FilingLabResults; onOpen: (row: LabRow) => void }) {
  const wide = useIsWide();
  if (!r.highest.length) return null;
  const rowOf = (h: HighestReported) => r.rows.find((x) => x.measurementId === h.measurementId);
  const look = (h: HighestReported): { tone: BadgeTone; icon: IconName; label: string } =>
    h.withinLimit === null
      ? { tone: 'caution', icon: 'pending', label: 'Not measured' }
      : h.withinLimit
        ? { tone: 'pass', icon: 'check', label: 'Within limit' }
        : { tone: 'fail', icon: 'cross', label: 'Over limit' };
  return (
    <Card
      title="Highest reported SAR"
      aside={
        <Text variant="small" tone="muted">
          Per market and exposure condition, scaled to the tune-up limit.
        </Text>
      }
      testID="lab-highest"
    >
      <View role={wide ? 'table' : 'list'} style={wide ? styles.table : styles.cards}>
        {wide ? (
          <View role="row" style={[styles.tr, styles.th]}>
            {['Market', 'Condition', 'Reported SAR', 'Limit', 'Margin', 'From', 'State'].map((h, i) => (
              <Text key={h} variant="smallStrong" tone="soft" role="columnheader" style={[styles.td, { flex: [0.8, 1, 1, 1, 0.8, 1.6, 1.2][i] }, [2, 3, 4].includes(i) && styles.right]}>
                {h}
              </Text>
            ))}
          </View>
        ) : null}
        {r.highest.map((h, i) => {
          const l = look(h);
          const row = rowOf(h);
          const from = h.measurementId ? `${h.transmitterId} · ${h.usePositionId} (${h.measurementId})` : '—';
          const mass = `${h.averagingMassKg * 1000} g`;
          return wide ? (
            <Pressable
              key={i}
              role="row"
              style={({ pressed }) => [styles.tr, i % 2 === 1 && styles.zebra, pressed && styles.pressed]}
              onPress={() => row && onOpen(row)}
              disabled={!row}
              accessibilityLabel={`${regimeShort(h.regime)} ${CONDITION_LABEL(h.usePositionKind)}: ${sar(h.reportedSarWPerKg)}, ${l.label}`}
              testID={`highest-${h.regime}-${h.usePositionKind}`}
            >
              <Text role="cell" variant="smallStrong" style={[styles.td, { flex: 0.8 }]}>
                {regimeShort(h.regime)}
              </Text>
              <Text role="cell" variant="small" style={[styles.td, { flex: 1 }]}>
                {CONDITION_LABEL(h.usePositionKind)} · {mass}
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 1 }]}>
                {sar(h.reportedSarWPerKg)}
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 1 }]}>
                {h.limitWPerKg} W/kg
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 0.8 }]}>
                {formatDb(h.marginDb)}
              </Text>
              <Text role="cell" variant="small" style={[styles.td, { flex: 1.6 }]}>
                {from}
              </Text>
              <View role="cell" style={[styles.td, { flex: 1.2 }]}>
                <StatusBadge tone={l.tone} icon={l.icon} label={l.label} />
              </View>
            </Pressable>
          ) : (
            <Pressable
              key={i}
              role="listitem"
              style={({ pressed }) => [styles.card, pressed && styles.pressed]}
              onPress={() => row && onOpen(row)}
              disabled={!row}
              testID={`highest-${h.regime}-${h.usePositionKind}`}
            >
              <View style={styles.cardHead}>
                <Text variant="bodyStrong" style={{ flex: 1 }}>
                  {regimeShort(h.regime)} · {CONDITION_LABEL(h.usePositionKind)} ({mass})
                </Text>
                <StatusBadge tone={l.tone} icon={l.icon} label={l.label} />
              </View>
              <Text variant="title" style={styles.num}>
                {sar(h.reportedSarWPerKg)}
              </Text>
              <Text variant="small" tone="soft">
                limit {h.limitWPerKg} W/kg · margin {formatDb(h.marginDb)} · {from}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </Card>
  );
}

const worst = (flags: LabCheck[]) => flags.find((f) => f.status === 'fail') ?? flags.find((f) => f.status === 'warning') ?? null;

const KIND_WORD: Partial<Record<CheckKind, string>> = { ...FAIL_WORD, liquid: 'Liquid', 'liquid-temperature': 'Liquid temperature', 'system-check': 'System check', drift: 'Drift', mass: 'Mass' };

function Measurements({ r, onOpen }: { r: FilingLabResults; onOpen: (row: LabRow) => void }) {
  const wide = useIsWide();
  const [filter, setFilter] = useState<LabFilter>(NO_LAB_FILTER);
  const [sort, setSort] = useState<LabSort>(DEFAULT_LAB_SORT);
  const positions = [...new Set(r.rows.map((x) => x.usePositionId))];
  const markets = [...new Set(r.rows.flatMap((x) => x.margins.map((m) => m.regime)))];
  const kinds = flaggedKinds(r.rows);
  const rows = sortLabRows(filterLabRows(r.rows, filter), sort, filter.regime);
  const refine = (part: Partial<LabFilter>) => setFilter((f) => ({ ...f, ...part }));
  return (
    <Card
      title={`Measurements (${r.rows.length})`}
      aside={
        <Text variant="small" tone="muted">
          {wide ? 'Sort by a column heading; open a row to see how it was scaled.' : 'Tap “How computed” to see how a row was scaled.'}
        </Text>
      }
      testID="lab-measurements"
    >
      {r.rows.length === 0 ? (
        <Text tone="muted">No measurements yet. The test engineer imports the lab’s spreadsheet or enters them by hand.</Text>
      ) : (
        <>
          <View style={styles.filters} testID="lab-filters">
            {positions.length > 1 ? (
              <ChoiceChips
                label="Use position"
                choices={[{ value: ALL, label: 'All positions' }, ...positions.map((p) => ({ value: p, label: p }))]}
                value={filter.usePositionId}
                onChange={(v) => refine({ usePositionId: v })}
                testID="lab-filter-position"
              />
            ) : null}
            {markets.length > 1 ? (
              <ChoiceChips
                label="Market (margin and limit flags)"
                choices={[{ value: ALL, label: 'All markets' }, ...markets.map((m) => ({ value: m, label: regimeShort(m) }))]}
                value={filter.regime}
                onChange={(v) => refine({ regime: v })}
                testID="lab-filter-market"
              />
            ) : null}
            <ChoiceChips
              label="Flags"
              choices={[
                { value: ALL, label: 'All rows' },
                { value: FLAGGED, label: 'With flags' },
                { value: NO_FLAGS, label: 'No flags' },
                ...kinds.map((k) => ({ value: k, label: KIND_WORD[k] ?? k })),
              ]}
              value={filter.flag}
              onChange={(v) => refine({ flag: v })}
              testID="lab-filter-flags"
            />
            {!wide ? (
              <ChoiceChips
                label="Sort by"
                choices={[
                  { value: 'id', label: 'Lab order' },
                  { value: 'sar1g', label: 'Highest 1 g' },
                  { value: 'sar10g', label: 'Highest 10 g' },
                  { value: 'margin', label: 'Least margin' },
                  { value: 'flags', label: 'Worst flags' },
                ]}
                value={sort.key}
                onChange={(key) => setSort({ key: key as LabSortKey, descending: key === 'sar1g' || key === 'sar10g' || key === 'flags' })}
                testID="lab-sort"
              />
            ) : null}
            <View style={styles.filterFoot}>
              <Text variant="small" tone="soft" testID="lab-shown">
                {rows.length === r.rows.length ? `All ${r.rows.length} rows` : `${rows.length} of ${r.rows.length} rows`}
              </Text>
              {isLabFiltered(filter) ? <Button label="Clear filters" variant="quiet" compact onPress={() => setFilter(NO_LAB_FILTER)} testID="lab-clear-filters" /> : null}
            </View>
          </View>
          {rows.length === 0 ? (
            <Text tone="muted">No rows match these filters.</Text>
          ) : wide ? (
            <MeasurementTable rows={rows} onOpen={onOpen} sort={sort} onSort={setSort} regime={filter.regime} />
          ) : (
            <MeasurementCards rows={rows} onOpen={onOpen} regime={filter.regime} />
          )}
        </>
      )}
    </Card>
  );
}

function FlagBadge({ flags }: { flags: LabCheck[] }) {
  const w = worst(flags);
  if (!w) return <StatusBadge tone="pass" icon="check" label="No flags" />;
  const n = flags.filter((f) => f.status !== 'pass').length;
  return <StatusBadge tone={CHECK_LOOK[w.status].tone} icon={CHECK_LOOK[w.status].icon} label={`${checkLabel(w)}${n > 1 ? ` +${n - 1}` : ''}`} />;
}

const COLS: { label: string; flex: number; sort: LabSortKey; numeric?: boolean }[] = [
  { label: 'ID', flex: 0.6, sort: 'id' },
  { label: 'Transmitter', flex: 1, sort: 'transmitter' },
  { label: 'Position', flex: 1.2, sort: 'position' },
  { label: 'Frequency', flex: 0.9, sort: 'frequency', numeric: true },
  { label: 'Power / scale', flex: 1.2, sort: 'scale', numeric: true },
  { label: '1 g SAR', flex: 0.8, sort: 'sar1g', numeric: true },
  { label: '10 g SAR', flex: 0.8, sort: 'sar10g', numeric: true },
  { label: 'Margin', flex: 0.7, sort: 'margin', numeric: true },
  { label: 'Flags and how to fix', flex: 2, sort: 'flags' },
];

function MeasurementTable({ rows, onOpen, sort, onSort, regime }: { rows: LabRow[]; onOpen: (row: LabRow) => void; sort: LabSort; onSort: (s: LabSort) => void; regime: string }) {
  return (
    <View style={{ gap: space.xs }}>
      <Text variant="small" tone="muted">
        Reported SAR in W/kg, scaled to the tune-up limit; margin in dB to the limit.
      </Text>
      <View role="table" style={[styles.table, styles.tableSticky]} testID="lab-table">
        <View role="row" style={[styles.tr, styles.th, styles.sticky]} testID="lab-table-head">
          {COLS.map((c) => {
            const active = sort.key === c.sort;
            return (
              <Pressable
                key={c.label}
                role="columnheader"
                aria-sort={active ? (sort.descending ? 'descending' : 'ascending') : 'none'}
                accessibilityRole="button"
                accessibilityLabel={`Sort by ${c.label}${active ? (sort.descending ? ', sorted high to low' : ', sorted low to high') : ''}`}
                onPress={() => onSort({ key: c.sort, descending: active ? !sort.descending : c.numeric === true && c.sort !== 'frequency' && c.sort !== 'margin' })}
                style={({ pressed }) => [styles.td, styles.sortHead, { flex: c.flex }, c.numeric && styles.sortHeadRight, pressed && styles.pressed]}
                testID={`lab-sort-${c.sort}`}
              >
                <Text variant="smallStrong" tone={active ? 'accent' : 'soft'} style={c.numeric ? styles.right : undefined}>
                  {c.label === 'Margin' && regime !== ALL ? `Margin ${regimeShort(regime)}` : c.label}
                  {active ? (sort.descending ? ' ↓' : ' ↑') : ''}
                </Text>
              </Pressable>
            );
          })}
        </View>
        {rows.map((x, i) => {
          const flags = flagsFor(x, regime);
          const w = worst(flags);
          return (
            <Pressable
              key={x.measurementId}
              role="row"
              onPress={() => onOpen(x)}
              style={({ pressed }) => [styles.tr, i % 2 === 1 && styles.zebra, pressed && styles.pressed]}
              accessibilityLabel={`${x.measurementId}: how computed`}
              testID={`lab-row-${x.measurementId}`}
            >
              <Text role="cell" variant="smallStrong" style={[styles.td, { flex: 0.6 }]}>
                {x.measurementId}
              </Text>
              <Text role="cell" variant="small" style={[styles.td, { flex: 1 }]}>
                {x.transmitterId}
              </Text>
              <Text role="cell" variant="small" style={[styles.td, { flex: 1.2 }]}>
                {x.usePositionId}
                {x.testPosition ? `\n${x.testPosition}` : ''}
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 0.9 }]}>
                {formatMhz(x.frequencyHz)}
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 1.2 }]}>
                {sig(x.measuredPowerDbm, 4)} / {sig(x.tuneUpPowerDbm, 4)} dBm{`\n`}×{x.scalingFactor.toFixed(3)}
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 0.8 }]} testID={`lab-row-${x.measurementId}-sar1g`}>
                {sarFigure(x.reportedSar1gWPerKg)}
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 0.8 }]}>
                {sarFigure(x.reportedSar10gWPerKg)}
              </Text>
              <Text role="cell" variant="figure" style={[styles.td, styles.right, styles.num, { flex: 0.7 }]}>
                {formatDb(marginFor(x, regime))}
              </Text>
              <View role="cell" style={[styles.td, { flex: 2, gap: 2 }]}>
                <FlagBadge flags={flags} />
                {w?.howToFix ? (
                  <Text variant="small" tone="soft" numberOfLines={2}>
                    {w.howToFix}
                  </Text>
                ) : null}
              </View>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

function MeasurementCards({ rows, onOpen, regime }: { rows: LabRow[]; onOpen: (row: LabRow) => void; regime: string }) {
  return (
    <View role="list" style={styles.cards} testID="lab-cards">
      {rows.map((x) => {
        const flags = flagsFor(x, regime);
        // Out of tolerance first, so the worst flag and how to fix it are always shown.
        const flagged = flags.filter((f) => f.status === 'fail').concat(flags.filter((f) => f.status === 'warning'));
        return (
          <View key={x.measurementId} role="listitem" style={styles.card} testID={`lab-row-${x.measurementId}`}>
            <View style={styles.cardHead}>
              <View style={{ flex: 1, gap: 2 }}>
                <Text variant="bodyStrong">
                  {x.measurementId} · {x.transmitterId}
                </Text>
                <Text variant="small" tone="soft">
                  {x.usePositionId}
                  {x.testPosition ? ` — ${x.testPosition}` : ''} · {formatMhz(x.frequencyHz)}
                </Text>
              </View>
              <FlagBadge flags={flags} />
            </View>
            <View style={styles.figures}>
              <Figure label="Reported 1 g" value={sar(x.reportedSar1gWPerKg)} />
              <Figure label="Reported 10 g" value={sar(x.reportedSar10gWPerKg)} />
              <Figure label="Scale" value={`×${x.scalingFactor.toFixed(3)}`} />
              <Figure label="Measured / tune-up" value={`${sig(x.measuredPowerDbm, 4)} / ${sig(x.tuneUpPowerDbm, 4)} dBm`} />
            </View>
            {flagged.slice(0, 3).map((f) => (
              <FlagLine key={f.id} check={f} />
            ))}
            <Button label="How computed" variant="quiet" compact icon="info" onPress={() => onOpen(x)} testID={`lab-how-${x.measurementId}`} style={{ alignSelf: 'flex-start' }} />
          </View>
        );
      })}
    </View>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <View style={styles.figure}>
      <Text variant="small" tone="muted">
        {label}
      </Text>
      <Text variant="figure" style={styles.num}>
        {value}
      </Text>
    </View>
  );
}

function FlagLine({ check }: { check: LabCheck }) {
  const l = CHECK_LOOK[check.status];
  return (
    <View style={styles.flagLine}>
      <StatusBadge tone={l.tone} icon={l.icon} label={checkLabel(check)} />
      <Text variant="small" style={{ flex: 1, minWidth: 180 }}>
        {check.message}{' '}
        {check.howToFix ? (
          <Text variant="small" tone="soft">
            How to fix: {sourceWords(check.howToFix)}
          </Text>
        ) : null}
      </Text>
    </View>
  );
}

function RowDetail({ row }: { row: LabRow }) {
  return (
    <View style={{ gap: space.md }}>
      <View style={styles.figures}>
        <Figure label="Reported 1 g" value={sar(row.reportedSar1gWPerKg)} />
        <Figure label="Reported 10 g" value={sar(row.reportedSar10gWPerKg)} />
      </View>
      {row.margins.map((m) => (
        <Text key={m.regime} variant="small" tone="soft">
          {regimeShort(m.regime)}: limit {m.limitWPerKg} W/kg over {m.averagingMassKg * 1000} g · margin {formatDb(m.marginDb)}
        </Text>
      ))}
      <DerivationBlock d={row.derivation} testID="lab-derivation" />
      {row.repeats ? (
        <View style={{ gap: 2 }}>
          <Text variant="smallStrong">Repeated measurements (KDB 865664 D01)</Text>
          {row.repeats.why.map((w) => (
            <Text key={w} variant="small" tone="soft">
              {w}
            </Text>
          ))}
        </View>
      ) : null}
      <View style={{ gap: space.xs }}>
        <Text variant="smallStrong">Checks of this measurement</Text>
        {row.flags.map((f) => (
          <FlagLine key={f.id} check={f} />
        ))}
      </View>
    </View>
  );
}

function CheckItem({ check }: { check: LabCheck }) {
  const l = CHECK_LOOK[check.status];
  return (
    <View style={styles.check} testID={`check-${check.id}`}>
      <View style={styles.cardHead}>
        <Text variant="bodyStrong" style={{ flex: 1 }}>
          {check.subject.id}
        </Text>
        <StatusBadge tone={l.tone} icon={l.icon} label={checkLabel(check)} />
      </View>
      <Text variant="small">{sourceWords(check.message)}</Text>
      {check.value ? (
        <Text variant="small" tone="soft">
          Value: {check.value}
        </Text>
      ) : null}
      {check.tolerance ? (
        <Text variant="small" tone="soft">
          Tolerance: {sourceWords(check.tolerance)}
        </Text>
      ) : null}
      {check.howToFix ? (
        <Text variant="small" style={{ color: palette.fail }}>
          How to fix: {sourceWords(check.howToFix)}
        </Text>
      ) : null}
      <Text variant="small" tone="muted">
        Source: {sourceWords(check.source)}
      </Text>
    </View>
  );
}

function Checks({ r, onOpen }: { r: FilingLabResults; onOpen: (c: LabCheck) => void }) {
  const [only, setOnly] = useState<'attention' | 'all'>('attention');
  const shown = r.checks.filter((c) => only === 'all' || c.status !== 'pass');
  const u = r.uncertainty;
  return (
    <Card title="Measurement checks" aside={<Text variant="small" tone="muted">{`${r.summary.failing} out of tolerance · ${r.summary.warnings} to check`}</Text>} testID="lab-checks">
      <ChoiceChips
        label="Show"
        hideLabel
        choices={
          [
            { value: 'attention', label: 'Needs attention' },
            { value: 'all', label: 'Every check' },
          ] as const
        }
        value={only}
        onChange={setOnly}
        testID="lab-checks-filter"
      />
      <Text variant="small" tone="soft" testID="lab-uncertainty">
        Uncertainty budget {u.required ? 'required' : 'not required'}
        {u.highestMeasuredSarWPerKg !== null ? ` (highest measured ${sig(u.highestMeasuredSarWPerKg, 3)} W/kg, ${u.highestMeasuredMass})` : ''}
        {u.expandedPct !== null ? ` · combined ${u.combinedStandardPct!.toFixed(1)} %, expanded ${u.expandedPct.toFixed(1)} % (k = 2, limit ${u.limitPct} %)` : ''}
      </Text>
      {shown.length === 0 ? <Text tone="muted">Every check is in tolerance.</Text> : null}
      {KIND_TITLES.map(({ kinds, title }) => {
        const items = shown.filter((c) => kinds.includes(c.kind));
        if (!items.length) return null;
        return (
          <View key={title} style={{ gap: space.xs }} testID={`checks-${kinds[0]}`}>
            <Text variant="label" tone="copper">
              {title}
            </Text>
            {items.map((c) => (
              <Pressable
                key={c.id}
                onPress={() => onOpen(c)}
                style={({ pressed }) => [styles.checkRow, pressed && styles.pressed]}
                accessibilityRole="button"
                accessibilityLabel={`${c.subject.id}: ${checkLabel(c)}. ${c.message}`}
                testID={`check-row-${c.id}`}
              >
                <StatusBadge tone={CHECK_LOOK[c.status].tone} icon={CHECK_LOOK[c.status].icon} label={checkLabel(c)} />
                <View style={{ flex: 1, minWidth: 200, gap: 2 }}>
                  <Text variant="small">{sourceWords(c.message)}</Text>
                  {c.value ? (
                    <Text variant="small" tone="muted">
                      {c.value}
                      {c.tolerance ? ` · tolerance ${sourceWords(c.tolerance)}` : ''}
                    </Text>
                  ) : null}
                  {c.howToFix ? (
                    <Text variant="small" tone="soft">
                      How to fix: {sourceWords(c.howToFix)}
                    </Text>
                  ) : null}
                </View>
              </Pressable>
            ))}
          </View>
        );
      })}
    </Card>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  filters: { gap: space.sm },
  table: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.md, overflow: 'hidden' },
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingHorizontal: space.sm, minHeight: layout.touchMinPx, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  th: { backgroundColor: palette.paper, minHeight: 36 },
  // Sticky needs no clipping ancestor between the header and the page's scroller.
  sticky: { position: 'sticky' as 'relative', top: 0, zIndex: 1 },
  tableSticky: { overflow: 'visible' },
  sortHead: { minHeight: 36, justifyContent: 'center', borderRadius: radii.sm },
  sortHeadRight: { alignItems: 'flex-end' },
  filterFoot: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  zebra: { backgroundColor: '#FBFAF7' },
  td: { minWidth: 0, paddingVertical: space.xs, paddingHorizontal: 4 },
  right: { textAlign: 'right' },
  num: { fontVariant: ['tabular-nums'] },
  pressed: { backgroundColor: palette.copperSoft },
  cards: { gap: space.md },
  card: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.lg, padding: space.md, gap: space.sm, backgroundColor: palette.surface },
  cardHead: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start', flexWrap: 'wrap' },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  figure: { flexBasis: '47%', flexGrow: 1, paddingVertical: space.xs, paddingHorizontal: space.sm, borderRadius: radii.md, backgroundColor: palette.paper },
  flagLine: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'flex-start' },
  check: { gap: space.xs },
  checkRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'flex-start', paddingVertical: space.xs, minHeight: layout.touchMinPx, borderRadius: radii.sm },
});
