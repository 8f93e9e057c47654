/**
 * Step 3, Use positions: each way the product is used, its kind, and the separation from each
 * antenna to the body — typed in mm, stored in m. An empty separation means "not given yet".
 * Under each position, the transmitters that run at a reduced power there (power modes); and the
 * trade's standard test positions for the kind of product, to add as a starting point.
 */
import { Controller, useFieldArray, useWatch, type Control } from 'react-hook-form';
import { View } from 'react-native';
import { USE_POSITION_KINDS, USE_POSITION_LABELS, type PowerModeTrigger, type UsePositionKind } from '../../constants/schemas/device-file';
import type { StandardPosition } from '../../constants/standard-positions';
import type { FilingDetail } from '../../constants/schemas/filings';
import { space } from '../../constants/theme';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { NumberField } from '../ui/number-field';
import { Text } from '../ui/text';
import { EditRows, nextId, type EditColumn } from './edit-rows';
import { FormSelect, FormText } from './form-fields';
import { PowerModesEditor, powerModesSummary } from './power-modes-editor';
import { StandardPositionsCard } from './standard-positions-card';
import { StepFrame } from './step-frame';
import { arrayOf, isObject, useAdoptRowIds, useStepForm } from './use-step-form';

interface Separation {
  antennaId: string;
  separationM: number | null;
}
interface PowerModeRow {
  transmitterId: string;
  reducedTuneUpPowerDbm: number | null;
  trigger: PowerModeTrigger;
}
interface PositionRow {
  rowId?: number;
  id: string;
  kind: UsePositionKind;
  separations: Separation[];
  powerModes?: PowerModeRow[];
}
export interface UsePositionsValues {
  usePositions: PositionRow[];
}

const KIND_OPTIONS = USE_POSITION_KINDS.map((k) => ({ value: k, label: USE_POSITION_LABELS[k] }));

export function UsePositionsStep({ filing }: { filing: FilingDetail }) {
  const antennaIds = filing.data.radios.antennas.map((a) => a.id);
  const transmitters = filing.data.radios.transmitters.map((t) => ({ id: t.id, maxTuneUpPowerDbm: t.maxTuneUpPowerDbm }));
  const transmitterIds = transmitters.map((t) => t.id);
  const usedIds = [...new Set(filing.data.radios.transmitters.flatMap((t) => [t.antennaId, ...t.moreAntennaIds]))];
  // Separations for antennas no longer under Radios are dropped: they could not be saved.
  const keepKnown = (rows: PositionRow[]): UsePositionsValues => ({
    usePositions: rows.map((p) => ({
      ...p,
      separations: arrayOf(p.separations).filter((s) => antennaIds.includes(String(s.antennaId))) as unknown as Separation[],
      // Likewise reduced powers of transmitters no longer under Radios.
      ...(p.powerModes ? { powerModes: arrayOf(p.powerModes).filter((m) => transmitterIds.includes(String(m.transmitterId))) as unknown as PowerModeRow[] } : {}),
    })),
  });
  const stepForm = useStepForm<UsePositionsValues>(filing, 'use-positions', (raw, saved) => keepKnown(isObject(raw) ? (arrayOf(raw.usePositions) as unknown as PositionRow[]) : saved.usePositions));
  const { form, editable } = stepForm;
  const { control } = form;
  const positions = useFieldArray({ control, name: 'usePositions', keyName: 'key' });
  const values = useWatch({ control, name: 'usePositions' }) ?? [];
  const common = { control, editable };
  useAdoptRowIds(form, 'usePositions', filing.data['use-positions'].usePositions);
  const positionEffects = (i: number) => {
    const given = (values[i]?.separations ?? []).map((s) => s.antennaId);
    const reduced = (values[i]?.powerModes ?? []).map((m) => m?.transmitterId);
    return [
      ...(given.length ? [`its separation${given.length === 1 ? '' : 's'} to ${given.join(', ')}`] : []),
      ...(reduced.length ? [`the reduced power${reduced.length === 1 ? '' : 's'} of ${reduced.join(', ')} in it`] : []),
    ];
  };
  const addStandard = (presets: StandardPosition[]) => {
    for (const p of presets) positions.append({ id: p.id, kind: p.kind, separations: usedIds.map((antennaId) => ({ antennaId, separationM: p.separationM })) });
  };
  const powerDetails = {
    label: 'Reduced power',
    summary: (i: number) => powerModesSummary(values[i]?.powerModes),
    render: (i: number) => <PowerModesEditor control={control} index={i} positionId={values[i]?.id ?? ''} transmitters={transmitters} editable={editable} />,
  };

  const columns: EditColumn[] = [
    { key: 'id', label: 'Position id', flex: 1.2, render: (i, h) => <FormText {...common} name={`usePositions.${i}.id`} label="Position id" hideLabel={h} testID={`pos-${i}-id`} /> },
    { key: 'kind', label: 'Kind', flex: 2.3, render: (i, h) => <FormSelect {...common} name={`usePositions.${i}.kind`} label="Kind" options={KIND_OPTIONS} hideLabel={h} testID={`pos-${i}-kind`} /> },
    ...antennaIds.map<EditColumn>((antennaId) => ({
      key: `sep-${antennaId}`,
      label: `${antennaId} (mm)`,
      flex: 1,
      half: true,
      render: (i, h) => <SeparationInput control={control} index={i} antennaId={antennaId} used={usedIds.includes(antennaId)} hideLabel={h} editable={editable} />,
    })),
  ];

  const lacking = values.map((p) => ({ id: p?.id, missing: usedIds.filter((a) => !(p?.separations ?? []).some((s) => s.antennaId === a)) })).filter((p) => p.missing.length);

  return (
    <StepFrame stepForm={stepForm} intro="How close the body gets to each antenna in each way the product is used, in millimetres (0 mm = touching).">
      {antennaIds.length === 0 ? (
        <Notice tone="caution" title="No antennas yet">
          Add the antennas under Radios first; each use position needs a separation for every antenna a transmitter uses.
        </Notice>
      ) : null}
      <Card title="Use positions">
        <EditRows
          noun="use position"
          columns={columns}
          count={positions.fields.length}
          keyOf={(i) => positions.fields[i].key}
          titleOf={(i) => values[i]?.id ?? ''}
          onAdd={() =>
            positions.append({
              id: nextId(
                'POS',
                values.map((p) => p?.id),
              ),
              kind: 'body-worn',
              separations: [],
            })
          }
          onRemove={(i) => positions.remove(i)}
          removalEffects={positionEffects}
          details={powerDetails}
          editable={editable}
          testID="positions"
          empty="No use positions yet. Add each way the product is held, worn or placed."
        />
      </Card>
      {editable ? <StandardPositionsCard productType={filing.data.device.productType} existingIds={values.map((p) => p?.id)} onAdd={addStandard} /> : null}
      {lacking.length ? (
        <Notice tone="caution" title="Separations still missing" testID="positions-lacking">
          <View style={{ gap: space.xxs }}>
            {lacking.map((p) => (
              <Text key={p.id} variant="small">
                {`${p.id || '(no id)'}: no separation for ${p.missing.join(', ')} — those combinations cannot be screened.`}
              </Text>
            ))}
          </View>
        </Notice>
      ) : null}
    </StepFrame>
  );
}

function SeparationInput({
  control,
  index,
  antennaId,
  used,
  hideLabel,
  editable,
}: {
  control: Control<UsePositionsValues>;
  index: number;
  antennaId: string;
  used: boolean;
  hideLabel: boolean;
  editable: boolean;
}) {
  return (
    <Controller
      control={control}
      name={`usePositions.${index}.separations`}
      render={({ field, fieldState }) => {
        const list: Separation[] = field.value ?? [];
        const j = list.findIndex((s) => s.antennaId === antennaId);
        const errors = fieldState.error as unknown as ({ separationM?: { message?: string }; antennaId?: { message?: string } } | undefined)[] | undefined;
        const error = j >= 0 ? (errors?.[j]?.separationM?.message ?? errors?.[j]?.antennaId?.message) : undefined;
        return (
          <NumberField
            label={`Separation to ${antennaId}`}
            hideLabel={hideLabel}
            unit="mm"
            scale={1e-3}
            editable={editable}
            value={j >= 0 ? list[j].separationM : null}
            placeholder={used ? 'needed' : 'not used'}
            hint={!hideLabel && j < 0 && used ? 'Needed: a transmitter uses this antenna.' : undefined}
            error={error}
            testID={`pos-${index}-sep-${antennaId}`}
            onChange={(v) => {
              if (v === null) field.onChange(list.filter((s) => s.antennaId !== antennaId));
              else if (j >= 0) field.onChange(list.map((s, k) => (k === j ? { ...s, separationM: v } : s)));
              else field.onChange([...list, { antennaId, separationM: v }]);
            }}
          />
        );
      }}
    />
  );
}
