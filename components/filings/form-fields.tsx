/**
 * Inputs bound to a step form by path; server and schema messages show under the right field.
 * Read-only (engineer, approver, a signed version): the value as plain text, numbers with their unit.
 */
import { Controller, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { InputBox } from '../ui/input-box';
import { NumberField, toDisplay } from '../ui/number-field';
import { ReadValue } from '../ui/read-value';
import { SelectField } from '../ui/select-field';

interface Common<T extends FieldValues> {
  control: Control<T>;
  name: FieldPath<T>;
  label: string;
  hideLabel?: boolean;
  editable: boolean;
  testID?: string;
  placeholder?: string;
  /** Shown under the field when it has no error. */
  hint?: string;
  /** Stands in for the field's error until the field is edited (a pasted cell to fix). */
  note?: FieldNote;
}

export interface FieldNote {
  message: string;
  /** In a table cell (label hidden): a word or two, the row says the rest. */
  short?: string;
  /** What was pasted, shown as it was while it is no value (a number field then holds null). */
  text?: string;
  onEdit: () => void;
}

const noteText = (note: FieldNote | undefined, inTable: boolean | undefined) => (note ? (inTable && note.short) || note.message : undefined);

/** `onValueChange` hears each change with the value before it (e.g. to carry a rename to what refers to it). */
type Changed = { onValueChange?: (next: string, previous: string) => void };

/** `capitals`: the field takes codes (grant identifiers); the keyboard offers capitals. */
export function FormText<T extends FieldValues>({ control, name, editable, onValueChange, capitals, note, ...rest }: Common<T> & Changed & { capitals?: boolean }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) =>
        editable ? (
          <InputBox
            {...rest}
            ref={field.ref}
            autoCapitalize={capitals ? 'characters' : undefined}
            autoCorrect={capitals ? false : undefined}
            editable={editable}
            value={field.value ?? ''}
            onChangeText={(next) => {
              const previous = field.value ?? '';
              field.onChange(next);
              note?.onEdit();
              onValueChange?.(next, previous);
            }}
            onBlur={field.onBlur}
            error={noteText(note, rest.hideLabel) ?? fieldState.error?.message}
          />
        ) : (
          <ReadValue label={rest.label} hideLabel={rest.hideLabel} value={field.value ?? ''} testID={rest.testID} />
        )
      }
    />
  );
}

/**
 * `scale` converts the shown unit to the stored one: stored = shown × scale. `optional`: an empty
 * field is no value at all (the key is left out), not a missing number.
 */
export function FormNumber<T extends FieldValues>({
  control,
  name,
  editable,
  unit,
  scale = 1,
  optional,
  onValueChange,
  note,
  ...rest
}: Common<T> & { unit: string; scale?: number; optional?: boolean; onValueChange?: (next: number | null) => void }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) =>
        !editable ? (
          <ReadValue label={rest.label} hideLabel={rest.hideLabel} value={toDisplay(field.value, scale)} unit={unit} numeric testID={rest.testID} />
        ) : (
          <NumberField
            {...rest}
            ref={field.ref}
            unit={unit}
            scale={scale}
            editable={editable}
            value={field.value}
            initialText={note?.text}
            onChange={(raw) => {
              const v = raw as number | null;
              field.onChange(optional && v === null ? undefined : v);
              note?.onEdit();
              onValueChange?.(v);
            }}
            onBlur={field.onBlur}
            error={noteText(note, rest.hideLabel) ?? fieldState.error?.message}
          />
        )
      }
    />
  );
}

export function FormSelect<T extends FieldValues>({ control, name, editable, options, onValueChange, note, ...rest }: Common<T> & Changed & { options: readonly { value: string; label: string }[] }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) =>
        !editable ? (
          <ReadValue label={rest.label} hideLabel={rest.hideLabel} value={options.find((o) => o.value === field.value)?.label ?? field.value ?? ''} testID={rest.testID} />
        ) : (
          <SelectField
            {...rest}
            options={options}
            disabled={!editable}
            value={field.value}
            onChange={(next) => {
              const previous = field.value ?? '';
              field.onChange(next);
              note?.onEdit();
              onValueChange?.(next, previous);
            }}
            error={noteText(note, rest.hideLabel) ?? fieldState.error?.message}
          />
        )
      }
    />
  );
}
