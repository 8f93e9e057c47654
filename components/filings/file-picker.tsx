/** Native: no file picker here (pasting the JSON works everywhere). The web version is file-picker.web.tsx. */
export function FilePicker(_props: { onPick: (name: string, content: string) => void }) {
  return null;
}
