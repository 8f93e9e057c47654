/**
 * The few rules react-native-web styles cannot say: a visible keyboard focus ring on every
 * focusable element (not a 1 px colour change), and tabular figures in every input.
 */
import { Platform } from 'react-native';
import { focusRing, palette } from '../../constants/theme';

const CSS = `
:focus-visible { outline: ${focusRing.width}px solid ${focusRing.color} !important; outline-offset: ${focusRing.offset}px !important; border-radius: 4px; }
input:focus-visible, textarea:focus-visible, select:focus-visible { outline-offset: 1px !important; }
input, textarea { font-variant-numeric: tabular-nums; }
[data-skiplink] { position: absolute !important; left: 8px; top: 8px; z-index: 1000; padding: 10px 16px; background: ${palette.accent}; border-radius: 8px; }
[data-skiplink]:not(:focus) { clip-path: inset(50%); width: 1px; height: 1px; overflow: hidden; white-space: nowrap; padding: 0; }
::selection { background: ${palette.accentSoft}; }
`;

export function installGlobalWebStyle(): void {
  if (Platform.OS !== 'web' || typeof document === 'undefined' || document.getElementById('fieldfile-global-style')) return;
  const el = document.createElement('style');
  el.id = 'fieldfile-global-style';
  el.textContent = CSS;
  document.head.appendChild(el);
}
