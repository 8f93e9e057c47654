/** Shared by evidence-picker.tsx (native) and evidence-picker.web.tsx. */
export interface PickedFile {
  file: Blob | { uri: string; name: string; type: string };
  fileName: string;
  sizeBytes: number;
}

export interface EvidencePickerProps {
  onFiles: (files: PickedFile[]) => void;
  wide: boolean;
  /** The input's accept attribute (media types of the chosen category). */
  accept: string;
  disabled?: boolean;
}
