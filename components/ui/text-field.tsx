/** A labelled text input with its hint and its error underneath; 44 px tall at least. */
import { useState } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { Controller, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { fonts, layout, palette, radii, space } from '../../constants/theme';
import { Icon } from '../icons';
import { Text } from './text';

export interface TextFieldProps extends TextInputProps {
  label: string;
  hint?: string;
  error?: string;
}

export function TextField({ label, hint, error, style, onFocus, onBlur, testID, ...rest }: TextFieldProps) {
  const [focused, setFocused] = useState(false);
  return (
    <View style={styles.field}>
      <Text variant="smallStrong" tone="soft">
        {label}
      </Text>
      <TextInput
        accessibilityLabel={label}
        aria-invalid={!!error}
        placeholderTextColor={palette.inkFaint}
        testID={testID}
        onFocus={(e) => {
          setFocused(true);
          onFocus?.(e);
        }}
        onBlur={(e) => {
          setFocused(false);
          onBlur?.(e);
        }}
        style={[styles.input, focused && styles.focused, !!error && styles.invalid, style]}
        {...rest}
      />
      {error ? (
        <View style={styles.errorRow} testID={testID ? `${testID}-error` : undefined}>
          <Icon name="warning" size={14} color={palette.fail} strokeWidth={2} />
          <Text variant="small" tone="fail" style={styles.errorText}>
            {error}
          </Text>
        </View>
      ) : hint ? (
        <Text variant="small" tone="muted">
          {hint}
        </Text>
      ) : null}
    </View>
  );
}

/** A TextField bound to a react-hook-form field. */
export function FormTextField<T extends FieldValues>({
  control,
  name,
  ...field
}: Omit<TextFieldProps, 'value' | 'onChangeText' | 'error'> & { control: Control<T>; name: FieldPath<T> }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: { value, onChange, onBlur }, fieldState }) => (
        <TextField {...field} value={value ?? ''} onChangeText={onChange} onBlur={onBlur} error={fieldState.error?.message} />
      )}
    />
  );
}

const styles = StyleSheet.create({
  field: { gap: space.xs },
  input: {
    minHeight: layout.touchMinPx,
    borderWidth: 1,
    borderColor: palette.lineStrong,
    borderRadius: radii.md,
    backgroundColor: palette.surface,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    fontFamily: fonts.regular,
    fontSize: 15,
    color: palette.ink,
  },
  focused: { borderColor: palette.copper, outlineColor: palette.copper, outlineWidth: 1, outlineStyle: 'solid' } as object,
  invalid: { borderColor: palette.fail },
  errorRow: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs, paddingTop: 1 },
  errorText: { flex: 1 },
});
