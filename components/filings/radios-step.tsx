/**
 * Step 2, Radios: antennas and transmitters, saved together (a transmitter names its antenna).
 * Frequencies are typed in MHz and stored in Hz; duty cycle typed in % and stored 0–1.
 */
import { useRef } from 'react';
import { useFieldArray, useWatch } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import type { FilingDetail } from '../../constants/schemas/filings';
import { space } from '../../constants/theme';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { EditRows, nextId, type EditColumn } from './edit-rows';
import { FormNumber, FormSelect, FormText } from './form-fields';
import { StepFrame } from './step-frame';
import { arrayOf, isObject, useAdoptRowIds, useStepForm } from './use-step-form';

interface AntennaRow {
  rowId?: number;
  id: string;
  gainDbi: number | null;
  location: string;
}
interface TransmitterRow {
  rowId?: number;
  id: string;
  technology: string;
  band: string;
  frequencyMinHz: number | null;
  frequencyMaxHz: number | null;
  maxTuneUpPowerDbm: number | null;
  dutyCycle: number | null;
  antennaId: string;
}
export interface RadiosValues {
  antennas: AntennaRow[];
  transmitters: TransmitterRow[];
}

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

  // Which antenna row each transmitter row follows (by the form's stable row keys), so that
  // renaming an antenna relabels exactly its transmitters even while the new label is being typed.
  const follows = useRef(new Map<string, string>());
  for (const [j, f] of transmitters.fields.entries()) {
    if (follows.current.has(f.key)) continue;
    const k = antennaValues.findIndex((a) => a?.id === transmitterValues[j]?.antennaId);
    if (k >= 0 && antennas.fields[k]) follows.current.set(f.key, antennas.fields[k].key);
  }
  const relabel = (antennaIndex: number, next: string) => {
    const antennaKey = antennas.fields[antennaIndex]?.key;
    transmitters.fields.forEach((f, j) => {
      if (antennaKey && follows.current.get(f.key) === antennaKey) form.setValue(`transmitters.${j}.antennaId`, next, { shouldValidate: true, shouldDirty: true });
    });
  };
  const follow = (txIndex: number, label: string) => {
    const k = antennaValues.findIndex((a) => a?.id === label);
    const txKey = transmitters.fields[txIndex]?.key;
    if (txKey && k >= 0) follows.current.set(txKey, antennas.fields[k].key);
  };

  useAdoptRowIds(form, 'antennas', filing.data.radios.antennas);
  useAdoptRowIds(form, 'transmitters', filing.data.radios.transmitters);

  const usedBy = (label: string) => transmitterValues.filter((t) => t?.antennaId === label).map((t) => t.id);
  const antennaEffects = (i: number) => {
    const label = antennaValues[i]?.id ?? '';
    const positions = filing.data['use-positions'].usePositions.filter((p) => p.separations.some((s) => s.antennaId === label)).map((p) => p.id);
    const txs = usedBy(label);
    return [
      ...(positions.length ? [`its separation in ${positions.length} use position${positions.length === 1 ? '' : 's'} (${positions.join(', ')})`] : []),
      ...(txs.length ? [`transmitters ${txs.join(', ')} are left without an antenna until you pick another`] : []),
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
    { key: 'gain', label: 'Gain (dBi)', flex: 0.9, half: true, render: (i, h) => <FormNumber {...common} name={`antennas.${i}.gainDbi`} label="Gain" unit="dBi" hideLabel={h} testID={`antenna-${i}-gain`} /> },
    { key: 'location', label: 'Where it sits', flex: 2.4, render: (i, h) => <FormText {...common} name={`antennas.${i}.location`} label="Where it sits" placeholder="e.g. top edge" hideLabel={h} testID={`antenna-${i}-location`} /> },
  ];
  const txColumns: EditColumn[] = [
    { key: 'id', label: 'Id', flex: 1.1, render: (i, h) => <FormText {...common} name={`transmitters.${i}.id`} label="Transmitter id" hideLabel={h} testID={`tx-${i}-id`} /> },
    { key: 'technology', label: 'Technology', flex: 1.5, half: true, render: (i, h) => <FormText {...common} name={`transmitters.${i}.technology`} label="Technology" placeholder="e.g. LTE" hideLabel={h} testID={`tx-${i}-technology`} /> },
    { key: 'band', label: 'Band', flex: 1.4, half: true, render: (i, h) => <FormText {...common} name={`transmitters.${i}.band`} label="Band" placeholder="e.g. Band 12" hideLabel={h} testID={`tx-${i}-band`} /> },
    { key: 'fmin', label: 'Lowest (MHz)', flex: 1.1, half: true, render: (i, h) => <FormNumber {...common} name={`transmitters.${i}.frequencyMinHz`} label="Lowest frequency" unit="MHz" scale={1e6} hideLabel={h} testID={`tx-${i}-fmin`} /> },
    { key: 'fmax', label: 'Highest (MHz)', flex: 1.1, half: true, render: (i, h) => <FormNumber {...common} name={`transmitters.${i}.frequencyMaxHz`} label="Highest frequency" unit="MHz" scale={1e6} hideLabel={h} testID={`tx-${i}-fmax`} /> },
    { key: 'power', label: 'Tune-up (dBm)', flex: 0.9, half: true, render: (i, h) => <FormNumber {...common} name={`transmitters.${i}.maxTuneUpPowerDbm`} label="Max tune-up power" unit="dBm" hideLabel={h} testID={`tx-${i}-power`} /> },
    { key: 'duty', label: 'Duty (%)', flex: 0.8, half: true, render: (i, h) => <FormNumber {...common} name={`transmitters.${i}.dutyCycle`} label="Duty cycle" unit="%" scale={0.01} hideLabel={h} testID={`tx-${i}-duty`} /> },
    {
      key: 'antenna',
      label: 'Antenna',
      flex: 1.1,
      render: (i, h) => (
        <FormSelect
          {...common}
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

  return (
    <StepFrame stepForm={stepForm}
      intro="Every transmitter with its band, maximum tune-up power and the antenna it uses. Frequencies in MHz, power in dBm, gain in dBi."
    >
      <Card title="Antennas">
        <EditRows
          noun="antenna"
          columns={antennaColumns}
          count={antennas.fields.length}
          keyOf={(i) => antennas.fields[i].key}
          titleOf={(i) => antennaValues[i]?.id ?? ''}
          onAdd={() => antennas.append({ id: nextId('ANT', antennaValues.map((a) => a?.id)), gainDbi: 0, location: '' })}
          onRemove={(i) => antennas.remove(i)}
          removalEffects={antennaEffects}
          editable={editable}
          testID="antennas"
          empty="No antennas yet. Add each antenna that a transmitter feeds."
        />
      </Card>
      <Card title="Transmitters">
        <EditRows
          noun="transmitter"
          columns={txColumns}
          count={transmitters.fields.length}
          keyOf={(i) => transmitters.fields[i].key}
          titleOf={(i) => transmitterValues[i]?.id ?? ''}
          onAdd={() =>
            transmitters.append({
              id: nextId('TX', transmitterValues.map((t) => t?.id)),
              technology: '',
              band: '',
              frequencyMinHz: null,
              frequencyMaxHz: null,
              maxTuneUpPowerDbm: null,
              dutyCycle: 1,
              antennaId: antennaValues[0]?.id ?? '',
            })
          }
          onRemove={(i) => transmitters.remove(i)}
          removalEffects={transmitterEffects}
          editable={editable}
          testID="transmitters"
          empty="No transmitters yet. Add one per band the device transmits in."
        />
        <View style={styles.note}>
          <Text variant="small" tone="muted">
            Duty cycle is the largest share of time the transmitter can be on (100 % = continuous). Screening evaluates each band at both edges and wherever a rule
            changes inside it.
          </Text>
        </View>
      </Card>
    </StepFrame>
  );
}

const styles = StyleSheet.create({ note: { paddingTop: space.xs } });
