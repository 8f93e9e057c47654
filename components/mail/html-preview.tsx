/** Native builds have no HTML frame here: the plain-text part below the preview stands in. */
import { Text } from '../ui/text';

export function HtmlPreview(_: { html: string; title: string }) {
  return (
    <Text variant="small" tone="muted">
      The formatted version opens in the web app; the plain-text version is below.
    </Text>
  );
}
