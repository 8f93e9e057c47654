/** Native: a short list of options as chips (the web uses a compact <select>, select-field.web.tsx). */
import { ChoiceChips } from './choice-chips';

export interface SelectFieldProps {
  label: string;
  hideLabel?: boolean;
  options: readonly { value: string; label: string }[];
  value: string | null | undefined;
  onChange: (value: string) => void;
  placeholder?: string;
  disabled?: boolean;
  error?: string;
  testID?: string;
}

export function SelectField({ options, ...rest }: SelectFieldProps) {
  return <ChoiceChips {...rest} choices={options} />;
}
