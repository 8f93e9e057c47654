/** Native: no file picker here yet; the import works from the web app. The web version is spreadsheet-picker.web.tsx. */
export function SpreadsheetPicker(_props: { onPick: (file: File) => void; label?: string }) {
  return null;
}
