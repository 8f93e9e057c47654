/**
 * Step 2, Radios: antennas and transmitters, saved together (a transmitter names its antenna).
 * Frequencies are typed in MHz and stored in Hz; duty cycle typed in % and stored 0–1. Each
 * transmitter's details: tune-up target ± tolerance (their sum is the maximum screening uses),
 * mode, modulation and bandwidth, a duty-factor preset with its source, and its certified module.
 */
import { sourceWords } from '../source-words';
import { useEffect, useRef, useState } from 'react';
import { Controller, useFieldArray, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { DUTY_FACTOR_PRESETS, findDutyFactorPreset } from '../../constants/duty-factors';
import { MAX_TRANSMITTERS } from '../../constants/schemas/device-file';
import type { FilingDetail } from '../../constants/schemas/filings';
import { space } from '../../constants/theme';
import { useIsWide } from '../../hooks/use-is-wide';
import { usePasteListener } from '../../hooks/use-paste-listener';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Checkbox } from '../ui/checkbox';
import { ChoiceChips } from '../ui/choice-chips';
import { InputBox } from '../ui/input-box';
import { Notice } from '../ui/notice';
import { ReadValue } from '../ui/read-value';
import { SelectField } from '../ui/select-field';
import { Text } from '../ui/text';
import { EditRows, nextId, type EditColumn } from './edit-rows';
import { FormNumber, FormSelect, FormText, type FieldNote } from './form-fields';
import { blankTransmitter, isBlock, readTransmitterBlock, type PastedTransmitter, type PasteNote, type PasteResult } from './paste-rows';
import { StepFrame } from './step-frame';
import { arrayOf, isObject, useAdoptRowIds, useStepForm } from './use-step-form';

interface AntennaRow {
  rowId?: number;
  id: string;
  gainDbi: number | null;
  location: string;
}
/** The form's row: a new row's fields (as "Add transmitter" and a paste make it) and what a saved one adds. */
interface TransmitterRow extends Omit<PastedTransmitter, 'tuneUpTargetDbm' | 'tuneUpToleranceDb'> {
  rowId?: number;
  tuneUpTargetDbm?: number | null;
  tuneUpToleranceDb?: number | null;
  moduleId?: string;
}
export interface RadiosValues {
  antennas: AntennaRow[];
  transmitters: TransmitterRow[];
}

const ANTENNA_USE_CHOICES = [
  { value: 'mimo' as const, label: 'All at once (MIMO)' },
  { value: 'switched' as const, label: 'One at a time (switched)' },
];
const PRESET_OPTIONS = [{ value: '', label: 'None (typed value)' }, ...DUTY_FACTOR_PRESETS.map((p) => ({ value: p.key, label: p.label }))];
const round2 = (x: number) => Math.round(x * 100) / 100;
const num = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

const fromDraft = (raw: unknown, saved: RadiosValues): RadiosValues =>
  isObject(raw) ? { antennas: arrayOf(raw.antennas) as unknown as AntennaRow[], transmitters: arrayOf(raw.transmitters) as unknown as TransmitterRow[] } : saved;

export function RadiosStep({ filing }: { filing: FilingDetail }) {
  const stepForm = useStepForm<RadiosValues>(filing, 'radios', fromDraft);
  const { form, editable } = stepForm;
  const { control } = form;
  const antennas = useFieldArray({ control, name: 'antennas', keyName: 'key' });
  const transmitters = useFieldArray({ control, name: 'transmitters', keyName: 'key' });
  const antennaValues = useWatch({ control, name: 'antennas' }) ?? [];
  const transmitterValues = useWatch({ control, name: 'transmitters' }) ?? [];
  const antennaOptions = antennaValues.filter((a) => a?.id).map((a) => ({ value: a.id, label: a.id }));
  const common = { control, editable };
  const wide = useIsWide();

  // Rows pasted from a spreadsheet: a note per cell to fix, by "<row>.<field>", until that cell is edited.
  const [notes, setNotes] = useState<ReadonlyMap<string, PasteNote>>(new Map());
  const [pasteReport, setPasteReport] = useState<(PasteResult & { start: number }) | null>(null);
  const [pasteText, setPasteText] = useState('');
  const pasteArea = useRef<View>(null);
  const noteFor = (i: number, field: string): FieldNote | undefined => {
    const key = `${i}.${field}`;
    const n = notes.get(key);
    if (!n) return undefined;
    const onEdit = () =>
      setNotes((m) => {
        if (!m.has(key)) return m;
        const next = new Map(m);
        next.delete(key);
        return next;
      });
    return { message: n.message, short: 'Fix', text: n.text, onEdit };
  };
  /** A removed row takes its notes with it; the rows after it move up one. */
  const dropNotesOf = (removed: number) =>
    setNotes((m) => {
      const next = new Map<string, PasteNote>();
      for (const [key, n] of m) {
        const [row, field] = [Number(key.slice(0, key.indexOf('.'))), key.slice(key.indexOf('.') + 1)];
        if (row !== removed) next.set(`${row > removed ? row - 1 : row}.${field}`, n);
      }
      return next;
    });

  // Which antenna row each transmitter row follows (by the form's stable row keys), so that
  // renaming an antenna relabels exactly its transmitters even while the new label is being typed.
  const follows = useRef(new Map<string, string>());
  for (const [j, f] of transmitters.fields.entries()) {
    if (follows.current.has(f.key)) continue;
    const k = antennaValues.findIndex((a) => a?.id === transmitterValues[j]?.antennaId);
    if (k >= 0 && antennas.fields[k]) follows.current.set(f.key, antennas.fields[k].key);
  }
  // The same for each transmitter's further antennas (MIMO or switched).
  const followsMore = useRef(new Map<string, string[]>());
  for (const [j, f] of transmitters.fields.entries()) {
    if (followsMore.current.has(f.key)) continue;
    const keys = (transmitterValues[j]?.moreAntennaIds ?? []).map((label) => antennas.fields[antennaValues.findIndex((a) => a?.id === label)]?.key).filter(Boolean) as string[];
    followsMore.current.set(f.key, keys);
  }
  const labelOf = (antennaKey: string, renamed?: { key: string; label: string }) =>
    renamed?.key === antennaKey ? renamed.label : (form.getValues(`antennas.${antennas.fields.findIndex((f) => f.key === antennaKey)}.id`) ?? '');
  const setMore = (j: number, keys: string[], renamed?: { key: string; label: string }) => {
    const txKey = transmitters.fields[j]?.key;
    if (txKey) followsMore.current.set(txKey, keys);
    form.setValue(
      `transmitters.${j}.moreAntennaIds`,
      keys.map((k) => labelOf(k, renamed)),
      { shouldValidate: true, shouldDirty: true },
    );
  };
  const relabel = (antennaIndex: number, next: string) => {
    const antennaKey = antennas.fields[antennaIndex]?.key;
    transmitters.fields.forEach((f, j) => {
      if (antennaKey && follows.current.get(f.key) === antennaKey) form.setValue(`transmitters.${j}.antennaId`, next, { shouldValidate: true, shouldDirty: true });
      const more = followsMore.current.get(f.key) ?? [];
      if (antennaKey && more.includes(antennaKey)) setMore(j, more, { key: antennaKey, label: next });
    });
  };
  const removeAntenna = (antennaIndex: number) => {
    const antennaKey = antennas.fields[antennaIndex]?.key;
    transmitters.fields.forEach((f, j) => {
      const more = followsMore.current.get(f.key) ?? [];
      if (antennaKey && more.includes(antennaKey))
        setMore(
          j,
          more.filter((k) => k !== antennaKey),
        );
    });
    antennas.remove(antennaIndex);
  };
  const toggleMore = (j: number, antennaKey: string, on: boolean) => {
    const more = followsMore.current.get(transmitters.fields[j]?.key ?? '') ?? [];
    const next = on ? [...more.filter((k) => k !== antennaKey), antennaKey] : more.filter((k) => k !== antennaKey);
    // Kept in the order of the antenna list.
    setMore(
      j,
      antennas.fields.map((f) => f.key).filter((k) => next.includes(k)),
    );
  };
  const follow = (txIndex: number, label: string) => {
    const k = antennaValues.findIndex((a) => a?.id === label);
    const txKey = transmitters.fields[txIndex]?.key;
    if (txKey && k >= 0) follows.current.set(txKey, antennas.fields[k].key);
  };

  const pasteRows = (text: string) => {
    const existing = form.getValues('transmitters') ?? [];
    const result = readTransmitterBlock(text, {
      visibleOrder: txColumns.map((c) => c.key),
      antennas: (form.getValues('antennas') ?? []).map((a) => a?.id).filter(Boolean),
      transmitters: existing,
    });
    const start = existing.length;
    if (result.rows.length) {
      transmitters.append(result.rows, { shouldFocus: false });
      setNotes((m) => {
        const next = new Map(m);
        for (const n of result.notes) next.set(`${start + n.row}.${n.field}`, n);
        return next;
      });
      void form.trigger('transmitters');
    }
    setPasteReport({ ...result, start });
  };
  usePasteListener(
    pasteArea,
    editable && wide
      ? (e) => {
          const text = e.clipboardData?.getData('text/plain') ?? '';
          const target = e.target as { getAttribute?: (name: string) => string | null } | null;
          const inBox = target?.getAttribute?.('data-testid') === 'transmitters-paste';
          // One value pasted into one field is the browser's to paste.
          if (!text.trim() || (!inBox && !isBlock(text))) return;
          e.preventDefault();
          setPasteText('');
          pasteRows(text);
        }
      : null,
  );
  // After a paste, the first cell to fix takes the focus.
  useEffect(() => {
    const first = pasteReport?.notes[0];
    if (first && pasteReport) form.setFocus(`transmitters.${pasteReport.start + first.row}.${first.field}` as never);
  }, [pasteReport, form]);

  useAdoptRowIds(form, 'antennas', filing.data.radios.antennas);
  useAdoptRowIds(form, 'transmitters', filing.data.radios.transmitters);

  const usedBy = (label: string) => transmitterValues.filter((t) => t?.antennaId === label).map((t) => t.id);
  const alsoUsedBy = (label: string) => transmitterValues.filter((t) => t?.moreAntennaIds?.includes(label)).map((t) => t.id);
  const antennaEffects = (i: number) => {
    const label = antennaValues[i]?.id ?? '';
    const positions = filing.data['use-positions'].usePositions.filter((p) => p.separations.some((s) => s.antennaId === label)).map((p) => p.id);
    const txs = usedBy(label);
    const also = alsoUsedBy(label);
    return [
      ...(positions.length ? [`its separation in ${positions.length} use position${positions.length === 1 ? '' : 's'} (${positions.join(', ')})`] : []),
      ...(txs.length ? [`transmitters ${txs.join(', ')} are left without an antenna until you pick another`] : []),
      ...(also.length ? [`${also.join(', ')} no longer use${also.length === 1 ? 's' : ''} it as a further antenna`] : []),
    ];
  };
  const transmitterEffects = (i: number) => {
    const label = transmitterValues[i]?.id ?? '';
    const combos = (filing.simultaneous ?? []).filter((c) => c.includes(label));
    return combos.map((c) => (c.length > 2 ? `its place in the co-transmission combination ${c.join(' + ')}` : `the co-transmission combination ${c.join(' + ')}`));
  };

  const antennaColumns: EditColumn[] = [
    {
      key: 'id',
      label: 'Antenna id',
      flex: 1.2,
      render: (i, h) => <FormText {...common} name={`antennas.${i}.id`} label="Antenna id" hideLabel={h} testID={`antenna-${i}-id`} onValueChange={(next) => relabel(i, next)} />,
    },
    {
      key: 'gain',
      label: 'Gain (dBi)',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormNumber {...common} name={`antennas.${i}.gainDbi`} label="Gain" unit="dBi" hideLabel={h} testID={`antenna-${i}-gain`} />,
    },
    {
      key: 'location',
      label: 'Where it sits',
      flex: 2.4,
      render: (i, h) => <FormText {...common} name={`antennas.${i}.location`} label="Where it sits" placeholder="e.g. top edge" hideLabel={h} testID={`antenna-${i}-location`} />,
    },
  ];
  // Widths for what each column holds: ids and antenna names need the room, four-digit MHz and dBm figures less.
  const txColumns: EditColumn[] = [
    { key: 'id', label: 'Id', flex: 1.3, render: (i, h) => <FormText {...common} note={noteFor(i, 'id')} name={`transmitters.${i}.id`} label="Transmitter id" hideLabel={h} testID={`tx-${i}-id`} /> },
    {
      key: 'technology',
      label: 'Technology',
      flex: 1.15,
      half: true,
      render: (i, h) => (
        <FormText {...common} note={noteFor(i, 'technology')} name={`transmitters.${i}.technology`} label="Technology" placeholder="e.g. LTE" hideLabel={h} testID={`tx-${i}-technology`} />
      ),
    },
    {
      key: 'band',
      label: 'Band',
      flex: 1.35,
      half: true,
      render: (i, h) => <FormText {...common} note={noteFor(i, 'band')} name={`transmitters.${i}.band`} label="Band" placeholder="e.g. Band 12" hideLabel={h} testID={`tx-${i}-band`} />,
    },
    {
      key: 'frequencyMinHz',
      label: 'Lowest (MHz)',
      flex: 1.0,
      half: true,
      render: (i, h) => (
        <FormNumber {...common} note={noteFor(i, 'frequencyMinHz')} name={`transmitters.${i}.frequencyMinHz`} label="Lowest frequency" unit="MHz" scale={1e6} hideLabel={h} testID={`tx-${i}-fmin`} />
      ),
    },
    {
      key: 'frequencyMaxHz',
      label: 'Highest (MHz)',
      flex: 1.0,
      half: true,
      render: (i, h) => (
        <FormNumber {...common} note={noteFor(i, 'frequencyMaxHz')} name={`transmitters.${i}.frequencyMaxHz`} label="Highest frequency" unit="MHz" scale={1e6} hideLabel={h} testID={`tx-${i}-fmax`} />
      ),
    },
    {
      key: 'maxTuneUpPowerDbm',
      label: 'Max tune-up (dBm)',
      flex: 0.85,
      half: true,
      // With a target and tolerance the maximum is their sum, shown and kept in step with them.
      render: (i, h) => (
        <FormNumber
          {...common}
          note={noteFor(i, 'maxTuneUpPowerDbm')}
          editable={editable && !derivedMax(i)}
          name={`transmitters.${i}.maxTuneUpPowerDbm`}
          label="Max tune-up power"
          unit="dBm"
          hideLabel={h}
          testID={`tx-${i}-power`}
        />
      ),
    },
    {
      key: 'dutyCycle',
      label: 'Duty (%)',
      flex: 0.8,
      half: true,
      render: (i, h) => (
        <FormNumber
          {...common}
          note={noteFor(i, 'dutyCycle')}
          name={`transmitters.${i}.dutyCycle`}
          label="Duty cycle"
          unit="%"
          scale={0.01}
          hideLabel={h}
          testID={`tx-${i}-duty`}
          onValueChange={(v) => {
            const preset = findDutyFactorPreset(form.getValues(`transmitters.${i}.dutyCyclePreset`) ?? '');
            if (preset && v !== preset.dutyCycle) form.setValue(`transmitters.${i}.dutyCyclePreset`, '', { shouldValidate: true, shouldDirty: true });
          }}
        />
      ),
    },
    {
      key: 'antennaId',
      label: 'Antenna',
      flex: 1.35,
      render: (i, h) => (
        <FormSelect
          {...common}
          note={noteFor(i, 'antennaId')}
          name={`transmitters.${i}.antennaId`}
          label="Antenna"
          options={antennaOptions}
          placeholder="Pick an antenna"
          hideLabel={h}
          testID={`tx-${i}-antenna`}
          onValueChange={(next) => follow(i, next)}
        />
      ),
    },
  ];

  const modules = filing.data.device.modules;
  const moduleOptions = [{ value: '', label: 'Not in a module' }, ...modules.map((m) => ({ value: m.id, label: m.name ? `${m.id} (${m.name})` : m.id }))];
  function derivedMax(i: number) {
    const t = transmitterValues[i];
    return num(t?.tuneUpTargetDbm) && num(t?.tuneUpToleranceDb);
  }
  const setMaxFromTarget = (i: number) => {
    const t = form.getValues(`transmitters.${i}`);
    if (num(t?.tuneUpTargetDbm) && num(t?.tuneUpToleranceDb)) {
      form.setValue(`transmitters.${i}.maxTuneUpPowerDbm`, round2(t.tuneUpTargetDbm + t.tuneUpToleranceDb), { shouldValidate: true, shouldDirty: true });
    }
  };
  const txDetails = {
    label: 'Antennas, tune-up, mode, duty factor',
    summary: (i: number) => {
      const t = transmitterValues[i];
      if (!t) return '';
      const parts = [
        num(t.tuneUpTargetDbm) && num(t.tuneUpToleranceDb) ? `${t.tuneUpTargetDbm} ± ${t.tuneUpToleranceDb} dB` : '',
        t.mode,
        findDutyFactorPreset(t.dutyCyclePreset ?? '')?.label ?? '',
        t.moduleId ? `module ${t.moduleId}` : '',
        t.moreAntennaIds?.length ? `${t.moreAntennaIds.length + 1} antennas, ${t.antennaUse === 'switched' ? 'switched' : 'MIMO'}` : '',
      ].filter(Boolean);
      return parts.length ? parts.join(' · ') : '';
    },
    render: (i: number) => {
      const t = transmitterValues[i];
      const preset = findDutyFactorPreset(t?.dutyCyclePreset ?? '');
      const more = t?.moreAntennaIds ?? [];
      const others = antennas.fields.map((f, k) => ({ key: f.key, label: antennaValues[k]?.id ?? '' })).filter((a) => a.label && a.label !== t?.antennaId);
      return (
        <View style={styles.detailGrid}>
          <View style={styles.detailWide} testID={`tx-${i}-more-antennas`}>
            <Text variant="smallStrong" tone="soft">
              {`Further antennas (besides ${t?.antennaId || 'the first'})`}
            </Text>
            {others.length ? (
              <View style={styles.checks}>
                {others.map((a) => (
                  <Checkbox key={a.key} label={a.label} checked={more.includes(a.label)} disabled={!editable} onChange={(on) => toggleMore(i, a.key, on)} testID={`tx-${i}-antenna-${a.label}`} />
                ))}
              </View>
            ) : (
              <Text variant="small" tone="muted">
                Add another antenna above to use it here.
              </Text>
            )}
            {more.length ? (
              <Controller
                control={control}
                name={`transmitters.${i}.antennaUse`}
                render={({ field }) => (
                  <ChoiceChips
                    label="With several antennas it transmits"
                    choices={ANTENNA_USE_CHOICES}
                    value={field.value ?? 'mimo'}
                    onChange={field.onChange}
                    disabled={!editable}
                    testID={`tx-${i}-antenna-use`}
                  />
                )}
              />
            ) : null}
            {more.length ? (
              <Text variant="small" tone="muted">
                {(t?.antennaUse ?? 'mimo') === 'mimo'
                  ? `MIMO: the maximum tune-up power is per stream; screening adds the ${more.length + 1} streams’ powers and evaluates the sum at each antenna (FCC KDB 662911 D01; check against the current edition).`
                  : 'Switched: one antenna at a time; screening evaluates each antenna at the tune-up power and reports the least favourable.'}
              </Text>
            ) : null}
          </View>
          <View style={styles.detailCell}>
            <FormNumber
              {...common}
              optional
              note={noteFor(i, 'tuneUpTargetDbm')}
              name={`transmitters.${i}.tuneUpTargetDbm`}
              label="Tune-up target"
              unit="dBm"
              testID={`tx-${i}-target`}
              onValueChange={() => setMaxFromTarget(i)}
            />
          </View>
          <View style={styles.detailCell}>
            <FormNumber
              {...common}
              optional
              note={noteFor(i, 'tuneUpToleranceDb')}
              name={`transmitters.${i}.tuneUpToleranceDb`}
              label="Tolerance ±"
              unit="dB"
              testID={`tx-${i}-tolerance`}
              onValueChange={() => setMaxFromTarget(i)}
            />
          </View>
          <View style={[styles.detailCell, styles.detailNote]}>
            <Text variant="small" tone="muted" testID={`tx-${i}-upper`}>
              {derivedMax(i) && num(t?.maxTuneUpPowerDbm)
                ? `Upper bound ${t.maxTuneUpPowerDbm} dBm (target ${t.tuneUpTargetDbm} dBm + ${t.tuneUpToleranceDb} dB): screening uses it.`
                : 'Screening uses the maximum tune-up power; with a target and tolerance it is their sum.'}
            </Text>
          </View>
          <View style={styles.detailCell}>
            <FormText {...common} note={noteFor(i, 'mode')} name={`transmitters.${i}.mode`} label="Mode (optional)" placeholder="e.g. QPSK, 1 RB" testID={`tx-${i}-mode`} />
          </View>
          <View style={styles.detailCell}>
            <FormText {...common} note={noteFor(i, 'modulation')} name={`transmitters.${i}.modulation`} label="Modulation (optional)" placeholder="e.g. QPSK" testID={`tx-${i}-modulation`} />
          </View>
          <View style={styles.detailCell}>
            <FormText {...common} note={noteFor(i, 'bandwidth')} name={`transmitters.${i}.bandwidth`} label="Bandwidth (optional)" placeholder="e.g. 10 MHz" testID={`tx-${i}-bandwidth`} />
          </View>
          <View style={styles.detailWide}>
            <FormSelect
              {...common}
              name={`transmitters.${i}.dutyCyclePreset`}
              label="Duty-factor preset"
              options={PRESET_OPTIONS}
              testID={`tx-${i}-duty-preset`}
              onValueChange={(next) => {
                const p = findDutyFactorPreset(next);
                if (p) form.setValue(`transmitters.${i}.dutyCycle`, p.dutyCycle, { shouldValidate: true, shouldDirty: true });
              }}
            />
            {preset ? (
              <Text variant="small" tone="muted" testID={`tx-${i}-duty-source`}>
                {`${preset.basis} Source: ${sourceWords(preset.source)}.`}
              </Text>
            ) : null}
          </View>
          {modules.length ? (
            <View style={styles.detailWide}>
              <Controller
                control={control}
                name={`transmitters.${i}.moduleId`}
                render={({ field, fieldState }) =>
                  editable ? (
                    <SelectField
                      label="Certified module"
                      options={moduleOptions}
                      value={field.value ?? ''}
                      onChange={(next) => field.onChange(next === '' ? undefined : next)}
                      error={fieldState.error?.message}
                      testID={`tx-${i}-module`}
                    />
                  ) : (
                    <ReadValue label="Certified module" value={field.value ?? 'Not in a module'} testID={`tx-${i}-module`} />
                  )
                }
              />
            </View>
          ) : null}
        </View>
      );
    },
  };

  return (
    <StepFrame stepForm={stepForm} intro="Every transmitter with its band, maximum tune-up power and the antenna it uses. Frequencies in MHz, power in dBm, gain in dBi.">
      <Card title="Antennas">
        <EditRows
          noun="antenna"
          columns={antennaColumns}
          count={antennas.fields.length}
          keyOf={(i) => antennas.fields[i].key}
          titleOf={(i) => antennaValues[i]?.id ?? ''}
          onAdd={() =>
            antennas.append({
              id: nextId(
                'ANT',
                antennaValues.map((a) => a?.id),
              ),
              gainDbi: 0,
              location: '',
            })
          }
          onRemove={removeAntenna}
          removalEffects={antennaEffects}
          editable={editable}
          testID="antennas"
          empty="No antennas yet. Add each antenna that a transmitter feeds."
        />
      </Card>
      <Card title="Transmitters">
        <View ref={pasteArea} style={styles.pasteArea}>
          <EditRows
            noun="transmitter"
            columns={txColumns}
            count={transmitters.fields.length}
            keyOf={(i) => transmitters.fields[i].key}
            titleOf={(i) => transmitterValues[i]?.id ?? ''}
            onAdd={() =>
              transmitters.append(
                blankTransmitter(
                  nextId(
                    'TX',
                    transmitterValues.map((t) => t?.id),
                  ),
                  antennaValues[0]?.id ?? '',
                ),
              )
            }
            onRemove={(i) => {
              transmitters.remove(i);
              dropNotesOf(i);
            }}
            removalEffects={transmitterEffects}
            details={txDetails}
            rowNotes={(i) => [...notes.entries()].filter(([key]) => key.startsWith(`${i}.`)).map(([, n]) => n.message)}
            editable={editable}
            testID="transmitters"
            empty="No transmitters yet. Add one per band the device transmits in."
          />
          {editable && wide ? (
            <View style={styles.paste}>
              <Text variant="small" tone="muted" testID="transmitters-paste-hint">
                {`Paste from a spreadsheet: copy rows — with their header row, or with the columns in this table’s order (${txColumns.map((c) => c.label).join(', ')}) — and paste them into any cell of the table or into this box. They are added after the last transmitter; nothing already here is overwritten. Tabs, commas or semicolons; decimal commas are read.`}
              </Text>
              <View style={styles.pasteRow}>
                <View style={styles.pasteBox}>
                  <InputBox
                    label="Paste rows from a spreadsheet"
                    hideLabel
                    placeholder="Click here and paste the rows (Ctrl+V, ⌘V)"
                    value={pasteText}
                    onChangeText={setPasteText}
                    testID="transmitters-paste"
                  />
                </View>
                {pasteText.trim() ? (
                  <Button
                    label="Add these rows"
                    icon="plus"
                    variant="secondary"
                    onPress={() => {
                      pasteRows(pasteText);
                      setPasteText('');
                    }}
                    testID="transmitters-paste-add"
                  />
                ) : null}
              </View>
            </View>
          ) : null}
          {pasteReport ? <PasteSummary report={pasteReport} remaining={[...notes.values()]} onDone={() => setPasteReport(null)} /> : null}
        </View>
        {editable && !wide ? (
          <Text variant="small" tone="muted" style={styles.note}>
            Pasting rows from a spreadsheet works on a wide screen.
          </Text>
        ) : null}
        <View style={styles.note}>
          <Text variant="small" tone="muted">
            Duty cycle is the largest share of time the transmitter can be on (100 % = continuous). Screening evaluates each band at both edges and wherever a rule changes inside it.
          </Text>
        </View>
      </Card>
    </StepFrame>
  );
}

/** What a paste added, what it left out, and the cells still to fix (each also marked in its row). */
function PasteSummary({ report, remaining, onDone }: { report: PasteResult & { start: number }; remaining: PasteNote[]; onDone: () => void }) {
  const n = report.rows.length;
  const lines = report.lines.length ? (report.lines.length === 1 ? `line ${report.lines[0]}` : `lines ${report.lines[0]}–${report.lines[report.lines.length - 1]}`) : '';
  const toFix = remaining.filter((x) => report.notes.includes(x)).sort((a, b) => a.line - b.line);
  const title = !n
    ? 'Nothing added: the pasted text has no rows to add.'
    : `Added ${n} transmitter${n === 1 ? '' : 's'} from ${lines} of the pasted rows${toFix.length ? ` · ${toFix.length} cell${toFix.length === 1 ? '' : 's'} to fix` : ' · every cell read'}`;
  return (
    <Notice tone={!n || toFix.length ? 'caution' : 'success'} title={title} testID="transmitters-paste-summary">
      <View style={styles.summary}>
        {n ? (
          <Text variant="small">
            {report.headerFound ? `Header row recognised: ${report.columns.join(', ')}.` : `No header row: columns taken in the table’s order (${report.columns.join(', ')}).`}
          </Text>
        ) : null}
        {report.ignored.length ? <Text variant="small">{`Left out: ${report.ignored.join('; ')}.`}</Text> : null}
        {report.leftOut.length ? (
          <Text variant="small">{`Line${report.leftOut.length === 1 ? '' : 's'} ${report.leftOut.join(', ')} not added: a filing has at most ${MAX_TRANSMITTERS} transmitters.`}</Text>
        ) : null}
        {toFix.length ? (
          <View testID="transmitters-paste-problems">
            <Text variant="smallStrong">Fix in the table (each cell is marked):</Text>
            {toFix.map((x) => (
              <Text key={`${x.row}.${x.field}`} variant="small">{`• ${x.message}`}</Text>
            ))}
          </View>
        ) : null}
        <Button label="Done" variant="secondary" onPress={onDone} testID="transmitters-paste-done" style={styles.done} />
      </View>
    </Notice>
  );
}

const styles = StyleSheet.create({
  note: { paddingTop: space.xs },
  pasteArea: { gap: space.md },
  paste: { gap: space.xs },
  pasteRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  pasteBox: { flex: 1, maxWidth: 560 },
  summary: { gap: space.xs },
  done: { alignSelf: 'flex-start' },
  detailGrid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  detailCell: { flexBasis: 180, flexGrow: 1, minWidth: 0 },
  detailNote: { flexBasis: 260, justifyContent: 'center' },
  detailWide: { flexBasis: '100%', gap: space.xs },
  checks: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
});
