/**
 * A use position's reduced powers: per transmitter, the tune-up power that applies in this
 * position and what triggers the reduction (hotspot back-off, proximity sensor, time-averaged SAR
 * limit). Screening uses that power here; transmitters not listed run at their maximum. A reduced
 * power must be below the transmitter's maximum (from Radios): said at the field as it is typed.
 */
import { Controller, useFieldArray, useWatch, type Control } from 'react-hook-form';
import { Pressable, StyleSheet, View } from 'react-native';
import { POWER_MODE_TRIGGER_LABELS, POWER_MODE_TRIGGERS } from '../../constants/schemas/device-file';
import { palette, radii, space } from '../../constants/theme';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { FieldError } from '../ui/field-error';
import { Text } from '../ui/text';
import { FormNumber, FormSelect } from './form-fields';
import type { UsePositionsValues } from './use-positions-step';

const TRIGGER_OPTIONS = POWER_MODE_TRIGGERS.map((t) => ({ value: t, label: POWER_MODE_TRIGGER_LABELS[t] }));

export interface PowerModeTransmitter {
  id: string;
  maxTuneUpPowerDbm: number;
}

/** The message for a reduced power that is no reduction (the server says the same). */
export function reducedPowerProblem(reducedDbm: unknown, tx: PowerModeTransmitter | undefined): string | undefined {
  if (!tx || typeof reducedDbm !== 'number') return undefined;
  return reducedDbm >= tx.maxTuneUpPowerDbm ? `A reduced power must be below ${tx.id}’s maximum tune-up power (${tx.maxTuneUpPowerDbm} dBm).` : undefined;
}

export function PowerModesEditor({
  control,
  index,
  positionId,
  transmitters,
  editable,
}: {
  control: Control<UsePositionsValues>;
  index: number;
  positionId: string;
  transmitters: PowerModeTransmitter[];
  editable: boolean;
}) {
  const modes = useFieldArray({ control, name: `usePositions.${index}.powerModes`, keyName: 'key' });
  const values = useWatch({ control, name: `usePositions.${index}.powerModes` }) ?? [];
  const common = { control, editable };
  const taken = new Set(values.map((m) => m?.transmitterId));
  const free = transmitters.filter((t) => !taken.has(t.id));
  const txOptions = (current: string | undefined) => transmitters.filter((t) => t.id === current || !taken.has(t.id)).map((t) => ({ value: t.id, label: `${t.id} (max ${t.maxTuneUpPowerDbm} dBm)` }));

  return (
    <View style={styles.wrap} testID={`pos-${index}-power-modes`}>
      <Text variant="small" tone="muted">
        {`Transmitters that run below their maximum in “${positionId || 'this position'}”, and what holds the power down. Screening uses the reduced power here; the lab tests it with the reduction active.`}
      </Text>
      {modes.fields.length === 0 ? (
        <Text variant="small" tone="soft" testID={`pos-${index}-power-modes-none`}>
          Every transmitter at its maximum tune-up power.
        </Text>
      ) : null}
      {modes.fields.map((field, j) => {
        const m = values[j];
        const tx = transmitters.find((t) => t.id === m?.transmitterId);
        const problem = reducedPowerProblem(m?.reducedTuneUpPowerDbm, tx);
        return (
          <View key={field.key} style={styles.row} testID={`pos-${index}-mode-${j}`}>
            <View style={styles.cell}>
              <FormSelect {...common} name={`usePositions.${index}.powerModes.${j}.transmitterId`} label="Transmitter" options={txOptions(m?.transmitterId)} testID={`pos-${index}-mode-${j}-tx`} />
            </View>
            <View style={styles.cell}>
              <FormNumber {...common} name={`usePositions.${index}.powerModes.${j}.reducedTuneUpPowerDbm`} label="Reduced tune-up power" unit="dBm" testID={`pos-${index}-mode-${j}-power`} />
              {problem ? (
                // Said as it is typed; once the server answers with the same words, its error shows instead.
                <Controller
                  control={control}
                  name={`usePositions.${index}.powerModes.${j}.reducedTuneUpPowerDbm`}
                  render={({ fieldState }) => (fieldState.error ? <></> : <FieldError message={problem} testID={`pos-${index}-mode-${j}-power-problem`} />)}
                />
              ) : null}
            </View>
            <View style={styles.cellWide}>
              <FormSelect {...common} name={`usePositions.${index}.powerModes.${j}.trigger`} label="Trigger" options={TRIGGER_OPTIONS} testID={`pos-${index}-mode-${j}-trigger`} />
            </View>
            {editable ? (
              <Pressable
                accessibilityRole="button"
                accessibilityLabel={`Remove the reduced power of ${m?.transmitterId || 'this transmitter'} in ${positionId}`}
                onPress={() => modes.remove(j)}
                testID={`pos-${index}-mode-${j}-remove`}
                style={({ pressed }) => [styles.remove, pressed && { backgroundColor: palette.failSoft }]}
              >
                <Icon name="cross" size={18} color={palette.fail} />
              </Pressable>
            ) : null}
          </View>
        );
      })}
      {editable && free.length ? (
        <Button
          label="Add a reduced power"
          variant="secondary"
          compact
          icon="plus"
          style={styles.add}
          onPress={() => modes.append({ transmitterId: free[0].id, reducedTuneUpPowerDbm: null, trigger: 'proximity-sensor' })}
          testID={`pos-${index}-add-mode`}
        />
      ) : null}
      {editable && !transmitters.length ? (
        <Text variant="small" tone="muted">
          Add transmitters under Radios first.
        </Text>
      ) : null}
      <Controller control={control} name={`usePositions.${index}.powerModes`} render={({ fieldState }) => (fieldState.error?.message ? <FieldError message={fieldState.error.message} /> : <></>)} />
    </View>
  );
}

/** One line for the collapsed row: which transmitters are reduced, to what and why. */
export function powerModesSummary(modes: readonly ({ transmitterId?: string; reducedTuneUpPowerDbm?: number | null; trigger?: string } | undefined)[] | undefined): string {
  const list = (modes ?? []).filter(Boolean);
  if (!list.length) return 'none — every transmitter at its maximum';
  return list
    .map((m) => `${m!.transmitterId} ${m!.reducedTuneUpPowerDbm ?? '?'} dBm (${POWER_MODE_TRIGGER_LABELS[m!.trigger as keyof typeof POWER_MODE_TRIGGER_LABELS]?.toLowerCase() ?? m!.trigger})`)
    .join('; ');
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm, paddingVertical: space.xs },
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'flex-start',
    gap: space.sm,
    padding: space.sm,
    borderWidth: 1,
    borderColor: palette.line,
    borderRadius: radii.md,
  },
  cell: { flexBasis: 160, flexGrow: 1, minWidth: 0 },
  cellWide: { flexBasis: 200, flexGrow: 2, minWidth: 0 },
  remove: { width: 44, height: 44, alignItems: 'center', justifyContent: 'center', borderRadius: radii.md },
  add: { alignSelf: 'flex-start' },
});
