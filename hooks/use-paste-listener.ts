/**
 * Web: hears paste events inside an element (a React Native Web view's ref is its DOM node), so a
 * table can take a block of cells pasted into any of its inputs. Elsewhere it does nothing.
 */
import { useEffect, useRef, type RefObject } from 'react';

interface PasteEventLike {
  target: unknown;
  clipboardData: { getData: (type: string) => string } | null;
  preventDefault: () => void;
}
interface Listens {
  addEventListener?: (type: 'paste', listener: (e: PasteEventLike) => void) => void;
  removeEventListener?: (type: 'paste', listener: (e: PasteEventLike) => void) => void;
}

/** `onPaste` null: not listening (read-only, or a layout that takes no blocks). */
export function usePasteListener(ref: RefObject<unknown>, onPaste: ((e: PasteEventLike) => void) | null) {
  const latest = useRef(onPaste);
  latest.current = onPaste;
  const on = onPaste !== null;
  useEffect(() => {
    const node = ref.current as Listens | null;
    if (!on || typeof node?.addEventListener !== 'function') return;
    const listener = (e: PasteEventLike) => latest.current?.(e);
    node.addEventListener('paste', listener);
    return () => node.removeEventListener?.('paste', listener);
  }, [ref, on]);
}
export type { PasteEventLike };
