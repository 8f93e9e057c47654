/**
 * A sent mail's HTML part, rendered as the recipient's mail program shows it: in a sandboxed
 * frame (no scripts; links open in a new tab), as tall as its content.
 */
import { useRef, useState } from 'react';
import { palette, radii } from '../../constants/theme';

export function HtmlPreview({ html, title }: { html: string; title: string }) {
  const frame = useRef<HTMLIFrameElement>(null);
  const [height, setHeight] = useState(200);
  const doc = /<html[\s>]/i.test(html)
    ? html.replace(/<html([^>]*)>/i, '<html$1><head><base target="_blank"></head>')
    : `<!doctype html><html><head><meta charset="utf-8"><base target="_blank"></head><body>${html}</body></html>`;
  return (
    <iframe
      ref={frame}
      title={title}
      srcDoc={doc}
      // Same origin only so the frame's height can be read; scripts stay off.
      sandbox="allow-same-origin allow-popups allow-popups-to-escape-sandbox"
      data-testid="outbox-message-html"
      onLoad={() => {
        const body = frame.current?.contentDocument?.body;
        if (body) setHeight(Math.min(Math.max(body.scrollHeight + 40, 120), 2000));
      }}
      style={{ width: '100%', height, border: `1px solid ${palette.line}`, borderRadius: radii.md, background: '#FFFFFF' }}
    />
  );
}
