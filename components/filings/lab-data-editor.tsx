/**
 * The lab's data entered by hand (the engineer) or read (every other role): measurements, liquid
 * checks, system checks, instruments and the uncertainty budget. Each table is one form validated
 * with its shared schema and saved whole with Save (the server replaces the table in one
 * transaction and the lab results above and below recompute). Long measurement tables are shown a
 * page at a time; a new row opens on the last page.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useState } from 'react';
import { Controller, useFieldArray, useForm, useWatch, type Control, type FieldValues, type Resolver, type UseFormReturn } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { DISTRIBUTIONS, INSTRUMENT_KINDS, INSTRUMENT_KIND_LABELS, LAB_SETS, LIQUID_KINDS, MAX_REPEATS, type LabSet } from '../../constants/schemas/lab';
import type { FilingDetail } from '../../constants/schemas/filings';
import { space } from '../../constants/theme';
import { filingKeys } from '../../hooks/queries/filings';
import { labKeys, labSetKey, saveLabSet, staleLabSet, useLabSetQuery, type LabSetRows } from '../../hooks/queries/lab';
import { LoadFailed, Loading } from '../layout/query-states';
import { Button } from '../ui/button';
import { ChoiceChips } from '../ui/choice-chips';
import { InputBox } from '../ui/input-box';
import { ReadValue } from '../ui/read-value';
import { SelectField } from '../ui/select-field';
import { Text } from '../ui/text';
import { EditRows, nextId, type EditColumn } from './edit-rows';
import { FormNumber, FormSelect, FormText } from './form-fields';
import { TableSaveBar, useTableSave } from './table-save';

export const MEASUREMENT_PAGE_ROWS = 20;

const TABLES: { value: LabSet; label: string }[] = [
  { value: 'measurements', label: 'Measurements' },
  { value: 'liquid-checks', label: 'Liquid checks' },
  { value: 'system-checks', label: 'System checks' },
  { value: 'instruments', label: 'Instruments' },
  { value: 'uncertainty-budget', label: 'Uncertainty budget' },
];
const NOUNS: Record<LabSet, { one: string; many: string }> = {
  measurements: { one: 'measurement', many: 'measurements' },
  'liquid-checks': { one: 'liquid check', many: 'liquid checks' },
  'system-checks': { one: 'system check', many: 'system checks' },
  instruments: { one: 'instrument', many: 'instruments' },
  'uncertainty-budget': { one: 'contribution', many: 'uncertainty budget' },
};

const today = () => new Date().toISOString().slice(0, 10);

/** Every table of the lab's data; `editable` is the engineer's right in an editable version. */
export function LabDataEditor({ filing, editable }: { filing: FilingDetail; editable: boolean }) {
  const [table, setTable] = useState<LabSet>('measurements');
  return (
    <View style={styles.wrap} testID="lab-data">
      <ChoiceChips label="Table" hideLabel choices={TABLES} value={table} onChange={setTable} testID="lab-data-table" />
      {/* Every table stays mounted, so switching tables keeps unsaved edits. */}
      {TABLES.map((t) => (
        <View key={t.value} style={t.value === table ? undefined : styles.hidden}>
          <LabSetLoader filing={filing} set={t.value} editable={editable} />
        </View>
      ))}
    </View>
  );
}

function LabSetLoader({ filing, set, editable }: { filing: FilingDetail; set: LabSet; editable: boolean }) {
  const q = useLabSetQuery(filing.id, set);
  if (q.isPending) return <Loading label={`Loading the ${NOUNS[set].many}…`} />;
  if (q.isError) return <LoadFailed what={`the ${NOUNS[set].many}`} error={q.error} onRetry={() => void q.refetch()} />;
  const props = { filing, editable, rows: q.data.rows, revision: q.data.revision };
  switch (set) {
    case 'measurements':
      return <MeasurementsTable {...(props as TableProps<'measurements'>)} />;
    case 'liquid-checks':
      return <LiquidChecksTable {...(props as TableProps<'liquid-checks'>)} />;
    case 'system-checks':
      return <SystemChecksTable {...(props as TableProps<'system-checks'>)} />;
    case 'instruments':
      return <InstrumentsTable {...(props as TableProps<'instruments'>)} />;
    case 'uncertainty-budget':
      return <BudgetTable {...(props as TableProps<'uncertainty-budget'>)} />;
  }
}

interface TableProps<S extends LabSet> {
  filing: FilingDetail;
  editable: boolean;
  rows: LabSetRows[S];
  revision: string;
}

/** One table's form: schema-validated, saved whole; the lab results recompute after each save. */
function useLabTableForm<S extends LabSet>(filing: FilingDetail, set: S, rows: LabSetRows[S], revision: string) {
  const key = LAB_SETS[set].key;
  const queryClient = useQueryClient();
  const toValues = useCallback((r: LabSetRows[S]) => ({ [key]: r }) as FieldValues, [key]);
  const fromValues = useCallback((v: FieldValues) => v[key] as LabSetRows[S], [key]);
  const form = useForm<FieldValues>({
    resolver: zodResolver(LAB_SETS[set].body as never) as unknown as Resolver<FieldValues>,
    defaultValues: toValues(rows),
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const send = useCallback((r: LabSetRows[S], rev: string | undefined) => saveLabSet(filing.id, set, r, rev), [filing.id, set]);
  const stale = useCallback((body: unknown) => staleLabSet(set, body), [set]);
  const onSaved = useCallback(
    (saved: { rows: LabSetRows[S]; revision: string }) => {
      queryClient.setQueryData(labSetKey(filing.id, set), (old: { version: number } | undefined) => ({ version: old?.version ?? 0, ...saved }));
      void queryClient.invalidateQueries({ queryKey: labKeys.results(filing.id) });
      void queryClient.invalidateQueries({ queryKey: filingKeys.detail(filing.id) });
    },
    [queryClient, filing.id, set],
  );
  const saving = useTableSave<FieldValues, LabSetRows[S]>({ form, rows, revision, send, stale, toValues, fromValues, onSaved });
  return { form, saving };
}

function SaveBar({ form, saving, set }: { form: UseFormReturn<FieldValues>; saving: ReturnType<typeof useLabTableForm>['saving']; set: LabSet }) {
  const dirty = form.formState.isDirty;
  return <TableSaveBar status={saving.status} dirty={dirty} onSave={() => void saving.save()} onResolve={saving.resolveConflict} noun={NOUNS[set].many} testID={`lab-${set}`} />;
}

/**
 * The next id in the lab's own pattern: after M11, M12 (the largest number with the most common
 * prefix, plus one); "<prefix>-<n>" when no id ends in a number.
 */
export function nextLabId(prefix: string, taken: readonly string[]): string {
  const counts = new Map<string, number[]>();
  for (const id of taken) {
    const m = /^(.*?)(\d+)$/.exec(id);
    if (m) counts.set(m[1], [...(counts.get(m[1]) ?? []), Number(m[2])]);
  }
  const best = [...counts.entries()].sort((a, b) => b[1].length - a[1].length)[0];
  if (!best) return nextId(prefix, taken);
  for (let n = Math.max(...best[1]) + 1; ; n++) if (!taken.includes(`${best[0]}${n}`)) return `${best[0]}${n}`;
}

const ids = (rows: unknown) => ((rows as { id?: string }[] | undefined) ?? []).map((r) => r?.id ?? '');

// --- measurements ------------------------------------------------------------------------------

function MeasurementsTable({ filing, editable, rows, revision }: TableProps<'measurements'>) {
  const { form, saving } = useLabTableForm(filing, 'measurements', rows, revision);
  const { control } = form;
  const list = useFieldArray({ control, name: 'measurements', keyName: 'key' });
  const values = (useWatch({ control, name: 'measurements' }) ?? []) as { id?: string; transmitterId?: string; usePositionId?: string }[];
  const liquid = useLabSetQuery(filing.id, 'liquid-checks').data?.rows ?? [];
  const system = useLabSetQuery(filing.id, 'system-checks').data?.rows ?? [];
  const [page, setPage] = useState(0);
  const pages = Math.max(1, Math.ceil(list.fields.length / MEASUREMENT_PAGE_ROWS));
  const shownPage = Math.min(page, pages - 1);
  const indices = useMemo(
    () => Array.from({ length: Math.min(MEASUREMENT_PAGE_ROWS, list.fields.length - shownPage * MEASUREMENT_PAGE_ROWS) }, (_, k) => shownPage * MEASUREMENT_PAGE_ROWS + k),
    [list.fields.length, shownPage],
  );
  const errors = form.formState.errors.measurements as unknown as (object | undefined)[] | undefined;
  const rowsWithErrors = Array.isArray(errors) ? errors.map((e, i) => (e ? i : -1)).filter((i) => i >= 0) : [];

  const transmitters = filing.data.radios.transmitters.map((t) => ({ value: t.id, label: t.id }));
  const positions = filing.data['use-positions'].usePositions.map((p) => ({ value: p.id, label: p.id }));
  const common = { control, editable };
  const optional = (label: string, options: { id: string }[]) => [{ value: '', label: `No ${label}` }, ...options.map((o) => ({ value: o.id, label: o.id }))];

  const columns: EditColumn[] = [
    { key: 'id', label: 'Id', flex: 0.7, render: (i, h) => <FormText {...common} name={`measurements.${i}.id`} label="Measurement id" hideLabel={h} testID={`m-${i}-id`} /> },
    {
      key: 'tx',
      label: 'Transmitter',
      flex: 1,
      half: true,
      render: (i, h) => <FormSelect {...common} name={`measurements.${i}.transmitterId`} label="Transmitter" options={transmitters} hideLabel={h} testID={`m-${i}-tx`} />,
    },
    {
      key: 'pos',
      label: 'Use position',
      flex: 1.1,
      half: true,
      render: (i, h) => <FormSelect {...common} name={`measurements.${i}.usePositionId`} label="Use position" options={positions} hideLabel={h} testID={`m-${i}-pos`} />,
    },
    {
      key: 'f',
      label: 'Frequency (MHz)',
      flex: 1,
      half: true,
      render: (i, h) => <FormNumber {...common} name={`measurements.${i}.frequencyHz`} label="Frequency" unit="MHz" scale={1e6} hideLabel={h} testID={`m-${i}-freq`} />,
    },
    {
      key: 'sep',
      label: 'Test separation (mm)',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormNumber {...common} name={`measurements.${i}.testSeparationM`} label="Test separation" unit="mm" scale={1e-3} hideLabel={h} testID={`m-${i}-sep`} />,
    },
    {
      key: 'p',
      label: 'Measured power (dBm)',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormNumber {...common} name={`measurements.${i}.measuredPowerDbm`} label="Measured power" unit="dBm" hideLabel={h} testID={`m-${i}-power`} />,
    },
    {
      key: 's1',
      label: '1 g SAR (W/kg)',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormNumber {...common} name={`measurements.${i}.sar1gWPerKg`} label="Measured 1 g SAR" unit="W/kg" hideLabel={h} testID={`m-${i}-sar1g`} />,
    },
    {
      key: 's10',
      label: '10 g SAR (W/kg)',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormNumber {...common} name={`measurements.${i}.sar10gWPerKg`} label="Measured 10 g SAR" unit="W/kg" hideLabel={h} testID={`m-${i}-sar10g`} />,
    },
  ];
  const details = {
    label: 'Date, tune-up, duty cycle, drift, peak, repeats, checks',
    summary: (i: number) => {
      const m = form.getValues(`measurements.${i}`) as Record<string, unknown> | undefined;
      if (!m) return '';
      return [m.testDate, m.testPosition, m.channel ? `ch ${m.channel}` : '', m.liquidCheckId ? `liquid ${m.liquidCheckId}` : '', m.systemCheckId ? `system ${m.systemCheckId}` : '']
        .filter(Boolean)
        .join(' · ');
    },
    render: (i: number) => (
      <View style={styles.detailGrid}>
        <View style={styles.detailCell}>
          <FormText {...common} name={`measurements.${i}.testDate`} label="Test date" placeholder="YYYY-MM-DD" testID={`m-${i}-date`} />
        </View>
        <View style={styles.detailCell}>
          <FormText {...common} name={`measurements.${i}.testPosition`} label="Test position" placeholder="e.g. left cheek" testID={`m-${i}-testpos`} />
        </View>
        <View style={styles.detailCell}>
          <FormText {...common} name={`measurements.${i}.channel`} label="Channel" testID={`m-${i}-channel`} />
        </View>
        <View style={styles.detailCell}>
          <FormNumber {...common} name={`measurements.${i}.tuneUpPowerDbm`} label="Tune-up limit" unit="dBm" hint="Blank: the transmitter’s maximum tune-up power." testID={`m-${i}-tuneup`} />
        </View>
        <View style={styles.detailCell}>
          <FormNumber {...common} name={`measurements.${i}.testDutyCycle`} label="Test duty cycle" unit="%" scale={0.01} testID={`m-${i}-duty`} />
        </View>
        <View style={styles.detailCell}>
          <FormNumber {...common} name={`measurements.${i}.driftDb`} label="Power drift" unit="dB" testID={`m-${i}-drift`} />
        </View>
        <View style={styles.detailCell}>
          <FormNumber {...common} name={`measurements.${i}.peakXMm`} label="Peak x" unit="mm" testID={`m-${i}-peakx`} />
        </View>
        <View style={styles.detailCell}>
          <FormNumber {...common} name={`measurements.${i}.peakYMm`} label="Peak y" unit="mm" testID={`m-${i}-peaky`} />
        </View>
        <View style={styles.detailCell}>
          <RepeatsField control={control} name={`measurements.${i}.repeatSarWPerKg`} editable={editable} testID={`m-${i}-repeats`} />
        </View>
        <View style={styles.detailCell}>
          <NullableSelect control={control} name={`measurements.${i}.liquidCheckId`} label="Liquid check" options={optional('liquid check', liquid)} editable={editable} testID={`m-${i}-liquid`} />
        </View>
        <View style={styles.detailCell}>
          <NullableSelect control={control} name={`measurements.${i}.systemCheckId`} label="System check" options={optional('system check', system)} editable={editable} testID={`m-${i}-system`} />
        </View>
      </View>
    ),
  };

  const add = () => {
    const last = values[values.length - 1];
    list.append({
      id: nextLabId('M', ids(values)),
      transmitterId: last?.transmitterId ?? transmitters[0]?.value ?? '',
      usePositionId: last?.usePositionId ?? positions[0]?.value ?? '',
      testPosition: '',
      channel: '',
      frequencyHz: null,
      testSeparationM: null,
      measuredPowerDbm: null,
      tuneUpPowerDbm: null,
      testDutyCycle: 1,
      sar1gWPerKg: null,
      sar10gWPerKg: null,
      repeatSarWPerKg: [],
      driftDb: null,
      testDate: today(),
      peakXMm: null,
      peakYMm: null,
      liquidCheckId: null,
      systemCheckId: null,
    });
    setPage(Math.floor(list.fields.length / MEASUREMENT_PAGE_ROWS));
  };

  return (
    <View style={styles.table} testID="lab-measurements-editor">
      <EditRows
        noun="measurement"
        columns={columns}
        count={list.fields.length}
        indices={indices}
        keyOf={(i) => list.fields[i].key}
        titleOf={(i) => values[i]?.id ?? ''}
        onAdd={add}
        onRemove={(i) => list.remove(i)}
        details={details}
        editable={editable}
        testID="lab-m"
        empty={editable ? 'No measurements yet. Add one by hand or import the lab’s spreadsheet.' : 'No measurements yet.'}
      />
      {pages > 1 ? (
        <View style={styles.pager} testID="lab-m-pager">
          <Button label="Previous" variant="quiet" compact icon="chevronLeft" disabled={shownPage === 0} onPress={() => setPage(shownPage - 1)} testID="lab-m-prev" />
          <Text variant="small" tone="soft">
            Rows {shownPage * MEASUREMENT_PAGE_ROWS + 1}–{shownPage * MEASUREMENT_PAGE_ROWS + indices.length} of {list.fields.length}
          </Text>
          <Button label="Next" variant="quiet" compact icon="chevronRight" disabled={shownPage >= pages - 1} onPress={() => setPage(shownPage + 1)} testID="lab-m-next" />
        </View>
      ) : null}
      {rowsWithErrors.length ? (
        <View style={styles.pager}>
          <Text variant="small" tone="fail">
            Rows to fix:
          </Text>
          {rowsWithErrors.slice(0, 8).map((i) => (
            <Button key={i} label={values[i]?.id || `row ${i + 1}`} variant="quiet" compact onPress={() => setPage(Math.floor(i / MEASUREMENT_PAGE_ROWS))} testID={`lab-m-fix-${i}`} />
          ))}
        </View>
      ) : null}
      {editable ? <SaveBar form={form} saving={saving} set="measurements" /> : null}
    </View>
  );
}

/** Repeated SAR values typed as a list ("0.81, 0.79"); a value that is not a number stays to be named. */
function RepeatsField({ control, name, editable, testID }: { control: Control<FieldValues>; name: string; editable: boolean; testID: string }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => {
        const list = (field.value ?? []) as number[];
        const shown = list.map((x) => (Number.isFinite(x) ? String(x) : '?')).join(', ');
        if (!editable) return <ReadValue label="Repeat SAR" value={shown || '—'} unit="W/kg" testID={testID} />;
        const error = fieldState.error?.message ?? (Array.isArray(fieldState.error) ? (fieldState.error as { message?: string }[]).find((e) => e?.message)?.message : undefined);
        return <RepeatsInput initial={shown} onChange={field.onChange} onBlur={field.onBlur} error={error} testID={testID} />;
      }}
    />
  );
}

function RepeatsInput({ initial, onChange, onBlur, error, testID }: { initial: string; onChange: (v: number[]) => void; onBlur: () => void; error?: string; testID: string }) {
  const [text, setText] = useState(initial);
  return (
    <InputBox
      label={`Repeat SAR (up to ${MAX_REPEATS})`}
      unit="W/kg"
      value={text}
      placeholder="e.g. 0.81, 0.79"
      onChangeText={(next) => {
        setText(next);
        const parts = next
          .split(/[;,\s]+/)
          .map((s) => s.trim())
          .filter(Boolean);
        onChange(parts.map((s) => Number(s.replace(',', '.'))));
      }}
      onBlur={onBlur}
      error={error}
      testID={testID}
    />
  );
}

/** A select whose empty choice is stored as null (no check named). */
function NullableSelect({
  control,
  name,
  label,
  options,
  editable,
  testID,
}: {
  control: Control<FieldValues>;
  name: string;
  label: string;
  options: { value: string; label: string }[];
  editable: boolean;
  testID: string;
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) =>
        editable ? (
          <SelectField label={label} options={options} value={field.value ?? ''} onChange={(v) => field.onChange(v === '' ? null : v)} error={fieldState.error?.message} testID={testID} />
        ) : (
          <ReadValue label={label} value={field.value ?? '—'} testID={testID} />
        )
      }
    />
  );
}

// --- liquid checks, system checks, instruments, uncertainty budget -------------------------------

function LiquidChecksTable({ filing, editable, rows, revision }: TableProps<'liquid-checks'>) {
  const { form, saving } = useLabTableForm(filing, 'liquid-checks', rows, revision);
  const { control } = form;
  const list = useFieldArray({ control, name: 'liquidChecks', keyName: 'key' });
  const values = useWatch({ control, name: 'liquidChecks' }) as { id?: string }[] | undefined;
  const namedBy = useNamedBy(filing.id, 'liquidCheckId');
  const common = { control, editable };
  const p = (i: number, f: string) => `liquidChecks.${i}.${f}`;
  const columns: EditColumn[] = [
    { key: 'id', label: 'Id', flex: 0.7, render: (i, h) => <FormText {...common} name={p(i, 'id')} label="Liquid check id" hideLabel={h} testID={`l-${i}-id`} /> },
    { key: 'date', label: 'Date', flex: 1, half: true, render: (i, h) => <FormText {...common} name={p(i, 'date')} label="Date" placeholder="YYYY-MM-DD" hideLabel={h} testID={`l-${i}-date`} /> },
    {
      key: 'liquid',
      label: 'Liquid',
      flex: 0.8,
      half: true,
      render: (i, h) => (
        <FormSelect {...common} name={p(i, 'liquid')} label="Liquid" options={LIQUID_KINDS.map((k) => ({ value: k, label: k === 'head' ? 'Head' : 'Body' }))} hideLabel={h} testID={`l-${i}-liquid`} />
      ),
    },
    {
      key: 'f',
      label: 'Frequency (MHz)',
      flex: 1,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'frequencyHz')} label="Frequency" unit="MHz" scale={1e6} hideLabel={h} testID={`l-${i}-freq`} />,
    },
    {
      key: 'er',
      label: 'Measured εr',
      flex: 0.8,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'relativePermittivity')} label="Measured εr" unit="" hideLabel={h} testID={`l-${i}-er`} />,
    },
    {
      key: 's',
      label: 'Measured σ (S/m)',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'conductivitySPerM')} label="Measured σ" unit="S/m" hideLabel={h} testID={`l-${i}-sigma`} />,
    },
    {
      key: 't',
      label: 'Temperature (°C)',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'temperatureC')} label="Liquid temperature" unit="°C" hideLabel={h} testID={`l-${i}-temp`} />,
    },
  ];
  return (
    <View style={styles.table} testID="lab-liquid-checks-editor">
      <EditRows
        noun="liquid check"
        columns={columns}
        count={list.fields.length}
        keyOf={(i) => list.fields[i].key}
        titleOf={(i) => values?.[i]?.id ?? ''}
        onAdd={() => list.append({ id: nextLabId('L', ids(values)), date: today(), liquid: 'head', frequencyHz: null, relativePermittivity: null, conductivitySPerM: null, temperatureC: null })}
        onRemove={(i) => list.remove(i)}
        removalEffects={(i) => namedBy(values?.[i]?.id)}
        editable={editable}
        testID="lab-l"
        empty="No liquid checks yet."
      />
      {editable ? <SaveBar form={form} saving={saving} set="liquid-checks" /> : null}
    </View>
  );
}

function SystemChecksTable({ filing, editable, rows, revision }: TableProps<'system-checks'>) {
  const { form, saving } = useLabTableForm(filing, 'system-checks', rows, revision);
  const { control } = form;
  const list = useFieldArray({ control, name: 'systemChecks', keyName: 'key' });
  const values = useWatch({ control, name: 'systemChecks' }) as { id?: string }[] | undefined;
  const namedBy = useNamedBy(filing.id, 'systemCheckId');
  const common = { control, editable };
  const p = (i: number, f: string) => `systemChecks.${i}.${f}`;
  const columns: EditColumn[] = [
    { key: 'id', label: 'Id', flex: 0.7, render: (i, h) => <FormText {...common} name={p(i, 'id')} label="System check id" hideLabel={h} testID={`s-${i}-id`} /> },
    { key: 'date', label: 'Date', flex: 1, half: true, render: (i, h) => <FormText {...common} name={p(i, 'date')} label="Date" placeholder="YYYY-MM-DD" hideLabel={h} testID={`s-${i}-date`} /> },
    {
      key: 'f',
      label: 'Frequency (MHz)',
      flex: 1,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'frequencyHz')} label="Frequency" unit="MHz" scale={1e6} hideLabel={h} testID={`s-${i}-freq`} />,
    },
    { key: 'dipole', label: 'Dipole serial', flex: 1, half: true, render: (i, h) => <FormText {...common} name={p(i, 'dipoleSerial')} label="Dipole serial" hideLabel={h} testID={`s-${i}-dipole`} /> },
    {
      key: 'mass',
      label: 'Mass',
      flex: 0.6,
      half: true,
      render: (i, h) => (
        <FormSelect
          {...common}
          name={p(i, 'averagingMass')}
          label="Averaging mass"
          options={[
            { value: '1g', label: '1 g' },
            { value: '10g', label: '10 g' },
          ]}
          hideLabel={h}
          testID={`s-${i}-mass`}
        />
      ),
    },
    {
      key: 'measured',
      label: 'Measured (W/kg per W)',
      flex: 1,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'measuredSarWPerKgPerW')} label="Measured SAR normalised to 1 W" unit="W/kg/W" hideLabel={h} testID={`s-${i}-measured`} />,
    },
    {
      key: 'target',
      label: 'Target (W/kg per W)',
      flex: 1,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'targetSarWPerKgPerW')} label="Target SAR normalised to 1 W" unit="W/kg/W" hideLabel={h} testID={`s-${i}-target`} />,
    },
  ];
  return (
    <View style={styles.table} testID="lab-system-checks-editor">
      <EditRows
        noun="system check"
        columns={columns}
        count={list.fields.length}
        keyOf={(i) => list.fields[i].key}
        titleOf={(i) => values?.[i]?.id ?? ''}
        onAdd={() => list.append({ id: nextLabId('S', ids(values)), date: today(), frequencyHz: null, dipoleSerial: '', averagingMass: '1g', measuredSarWPerKgPerW: null, targetSarWPerKgPerW: null })}
        onRemove={(i) => list.remove(i)}
        removalEffects={(i) => namedBy(values?.[i]?.id)}
        editable={editable}
        testID="lab-s"
        empty="No system checks yet."
      />
      {editable ? <SaveBar form={form} saving={saving} set="system-checks" /> : null}
    </View>
  );
}

function InstrumentsTable({ filing, editable, rows, revision }: TableProps<'instruments'>) {
  const { form, saving } = useLabTableForm(filing, 'instruments', rows, revision);
  const { control } = form;
  const list = useFieldArray({ control, name: 'instruments', keyName: 'key' });
  const values = useWatch({ control, name: 'instruments' }) as { id?: string }[] | undefined;
  const common = { control, editable };
  const p = (i: number, f: string) => `instruments.${i}.${f}`;
  const columns: EditColumn[] = [
    { key: 'id', label: 'Id', flex: 0.7, render: (i, h) => <FormText {...common} name={p(i, 'id')} label="Instrument id" hideLabel={h} testID={`i-${i}-id`} /> },
    {
      key: 'kind',
      label: 'Kind',
      flex: 1.3,
      half: true,
      render: (i, h) => (
        <FormSelect {...common} name={p(i, 'kind')} label="Kind" options={INSTRUMENT_KINDS.map((k) => ({ value: k, label: INSTRUMENT_KIND_LABELS[k] }))} hideLabel={h} testID={`i-${i}-kind`} />
      ),
    },
    { key: 'model', label: 'Model', flex: 1, half: true, render: (i, h) => <FormText {...common} name={p(i, 'model')} label="Model" hideLabel={h} testID={`i-${i}-model`} /> },
    { key: 'serial', label: 'Serial', flex: 1, half: true, render: (i, h) => <FormText {...common} name={p(i, 'serial')} label="Serial" hideLabel={h} testID={`i-${i}-serial`} /> },
    {
      key: 'cal',
      label: 'Calibrated',
      flex: 1,
      half: true,
      render: (i, h) => <FormText {...common} name={p(i, 'calibrationDate')} label="Calibration date" placeholder="YYYY-MM-DD" hideLabel={h} testID={`i-${i}-cal`} />,
    },
    { key: 'due', label: 'Due', flex: 1, half: true, render: (i, h) => <FormText {...common} name={p(i, 'dueDate')} label="Due date" placeholder="YYYY-MM-DD" hideLabel={h} testID={`i-${i}-due`} /> },
  ];
  return (
    <View style={styles.table} testID="lab-instruments-editor">
      <EditRows
        noun="instrument"
        columns={columns}
        count={list.fields.length}
        keyOf={(i) => list.fields[i].key}
        titleOf={(i) => values?.[i]?.id ?? ''}
        onAdd={() => list.append({ id: nextLabId('I', ids(values)), kind: 'probe', model: '', serial: '', calibrationDate: today(), dueDate: '' })}
        onRemove={(i) => list.remove(i)}
        editable={editable}
        testID="lab-i"
        empty="No instruments yet."
      />
      {editable ? <SaveBar form={form} saving={saving} set="instruments" /> : null}
    </View>
  );
}

function BudgetTable({ filing, editable, rows, revision }: TableProps<'uncertainty-budget'>) {
  const { form, saving } = useLabTableForm(filing, 'uncertainty-budget', rows, revision);
  const { control } = form;
  const list = useFieldArray({ control, name: 'components', keyName: 'key' });
  const values = useWatch({ control, name: 'components' }) as { name?: string }[] | undefined;
  const common = { control, editable };
  const p = (i: number, f: string) => `components.${i}.${f}`;
  const columns: EditColumn[] = [
    { key: 'name', label: 'Contribution', flex: 2, render: (i, h) => <FormText {...common} name={p(i, 'name')} label="Contribution" hideLabel={h} testID={`u-${i}-name`} /> },
    { key: 'value', label: 'Value (%)', flex: 0.8, half: true, render: (i, h) => <FormNumber {...common} name={p(i, 'valuePct')} label="Value" unit="%" hideLabel={h} testID={`u-${i}-value`} /> },
    {
      key: 'dist',
      label: 'Distribution',
      flex: 1,
      half: true,
      render: (i, h) => <FormSelect {...common} name={p(i, 'distribution')} label="Distribution" options={DISTRIBUTIONS.map((d) => ({ value: d, label: d }))} hideLabel={h} testID={`u-${i}-dist`} />,
    },
    {
      key: 'div',
      label: 'Divisor',
      flex: 0.7,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'divisor')} label="Divisor" unit="" hint="Blank: from the distribution." hideLabel={h} testID={`u-${i}-div`} />,
    },
    {
      key: 'ci',
      label: 'Sensitivity cᵢ',
      flex: 0.7,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'sensitivity')} label="Sensitivity coefficient" unit="" hideLabel={h} testID={`u-${i}-ci`} />,
    },
    {
      key: 'dof',
      label: 'Degrees of freedom',
      flex: 0.8,
      half: true,
      render: (i, h) => <FormNumber {...common} name={p(i, 'degreesOfFreedom')} label="Degrees of freedom" unit="" hint="Blank: ∞." hideLabel={h} testID={`u-${i}-dof`} />,
    },
  ];
  return (
    <View style={styles.table} testID="lab-uncertainty-budget-editor">
      <EditRows
        noun="contribution"
        columns={columns}
        count={list.fields.length}
        keyOf={(i) => list.fields[i].key}
        titleOf={(i) => values?.[i]?.name ?? ''}
        onAdd={() => list.append({ name: '', valuePct: null, distribution: 'rectangular', divisor: null, sensitivity: 1, degreesOfFreedom: null })}
        onRemove={(i) => list.remove(i)}
        editable={editable}
        testID="lab-u"
        empty="No uncertainty budget yet. It is needed when the highest measured SAR is at or above the threshold shown under the checks."
      />
      {editable ? <SaveBar form={form} saving={saving} set="uncertainty-budget" /> : null}
    </View>
  );
}

/** Removing a check leaves the measurements that name it pointing nowhere: say which. */
function useNamedBy(filingId: number, field: 'liquidCheckId' | 'systemCheckId') {
  const measurements = useLabSetQuery(filingId, 'measurements').data?.rows ?? [];
  return (id: string | undefined): string[] => {
    const naming = id ? measurements.filter((m) => m[field] === id).map((m) => m.id) : [];
    return naming.length
      ? [`measurement${naming.length === 1 ? '' : 's'} ${naming.slice(0, 8).join(', ')}${naming.length > 8 ? '…' : ''} name it: pick another check there, or the measurements table will not save`]
      : [];
  };
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  hidden: { display: 'none' },
  table: { gap: space.md },
  pager: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  detailGrid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  detailCell: { flexBasis: 180, flexGrow: 1, minWidth: 0 },
});
