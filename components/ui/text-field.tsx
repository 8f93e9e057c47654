/** A labelled text input bound to a react-hook-form field (the box itself is InputBox). */
import { Controller, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { InputBox, type InputBoxProps } from './input-box';

export type TextFieldProps = InputBoxProps;
export const TextField = InputBox;

export function FormTextField<T extends FieldValues>({ control, name, ...field }: Omit<TextFieldProps, 'value' | 'onChangeText' | 'error'> & { control: Control<T>; name: FieldPath<T> }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field: { value, onChange, onBlur, ref }, fieldState }) => (
        <TextField {...field} ref={ref} value={value ?? ''} onChangeText={onChange} onBlur={onBlur} error={fieldState.error?.message} />
      )}
    />
  );
}
