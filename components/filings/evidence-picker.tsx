/** Native: no file picker yet (the web app, on a phone too, uploads). The web version is evidence-picker.web.tsx. */
import type { EvidencePickerProps } from './evidence-picker-types';

export type { EvidencePickerProps, PickedFile } from './evidence-picker-types';

export function EvidencePicker(_props: EvidencePickerProps) {
  return null;
}
