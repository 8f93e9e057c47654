/** The device's identity fields, used by "New filing" (under `device.`) and by the Device step. */
import { Controller, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { PRODUCT_TYPES, PRODUCT_TYPE_LABELS } from '../../constants/schemas/device-file';
import { space } from '../../constants/theme';
import { useIsWide } from '../../hooks/use-is-wide';
import { ChoiceChips } from '../ui/choice-chips';
import { InputBox } from '../ui/input-box';
import { ReadValue } from '../ui/read-value';

const TEXT_FIELDS = [
  { key: 'name', label: 'Device name', placeholder: 'e.g. Trailhound TH-4 rugged tracker' },
  { key: 'model', label: 'Model number', placeholder: 'e.g. TH4-LW2' },
  { key: 'applicant', label: 'Applicant', placeholder: 'The company that applies for the grant' },
  { key: 'hardwareVersion', label: 'Hardware version (optional)', placeholder: 'e.g. EVT3 rev C' },
  { key: 'firmwareVersion', label: 'Firmware version (optional)', placeholder: 'e.g. 2.4.1' },
] as const;

const PRODUCT_CHOICES = PRODUCT_TYPES.map((value) => ({ value, label: PRODUCT_TYPE_LABELS[value] }));

/** `onSubmit`: Enter in a text field submits (the new-filing form; autosaved steps have nothing to submit). */
export function DeviceFields<T extends FieldValues>({
  control,
  prefix = '',
  editable = true,
  testIDPrefix = 'device',
  onSubmit,
}: {
  control: Control<T>;
  prefix?: '' | 'device.';
  editable?: boolean;
  testIDPrefix?: string;
  onSubmit?: () => void;
}) {
  const wide = useIsWide();
  const name = (key: string) => `${prefix}${key}` as FieldPath<T>;
  return (
    <View style={styles.fields}>
      <View style={[styles.grid, wide && styles.gridWide]}>
        {TEXT_FIELDS.map((f) => (
          <View key={f.key} style={wide ? styles.half : undefined}>
            <Controller
              control={control}
              name={name(f.key)}
              render={({ field, fieldState }) =>
                !editable ? (
                  <ReadValue label={f.label} value={field.value ?? ''} testID={`${testIDPrefix}-${f.key}`} />
                ) : (
                  <InputBox
                    ref={field.ref}
                    onSubmitEditing={onSubmit}
                    label={f.label}
                    placeholder={f.placeholder}
                    value={field.value ?? ''}
                    onChangeText={field.onChange}
                    onBlur={field.onBlur}
                    error={fieldState.error?.message}
                    editable={editable}
                    testID={`${testIDPrefix}-${f.key}`}
                  />
                )
              }
            />
          </View>
        ))}
      </View>
      <Controller
        control={control}
        name={name('productType')}
        render={({ field, fieldState }) => (
          <ChoiceChips
            label="Product type"
            choices={PRODUCT_CHOICES}
            value={field.value}
            onChange={field.onChange}
            disabled={!editable}
            error={fieldState.error?.message}
            testID={`${testIDPrefix}-productType`}
          />
        )}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.lg },
  grid: { gap: space.lg },
  gridWide: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  half: { flexBasis: '47%', flexGrow: 1 },
});
