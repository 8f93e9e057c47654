/** Native: picking a zip is not offered here; the hash check below works everywhere. */
import { Text } from '../ui/text';

export function ZipPicker(_props: { onPick: (file: Blob & { name: string }) => void }) {
  return (
    <Text variant="small" tone="muted">
      Uploading a zip is available in the web app; paste its SHA-256 below instead.
    </Text>
  );
}
