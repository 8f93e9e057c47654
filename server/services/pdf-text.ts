/**
 * The text of a PDF, page by page (pdfjs-dist), as the report read-back needs it. This module runs
 * inside the read-back worker thread (server/pdf-text-worker.cjs via pdf-text-pool.ts), never on
 * the event loop: pdfjs parses on the thread that calls it, and its legacy build installs
 * polyfills process-wide (a JavaScript Array.prototype.push, a `navigator` global…) that must not
 * reach the server's own code.
 */
import path from 'node:path';

export type PdfText = { status: 'read'; pages: string[] } | { status: 'unreadable'; reason: string; pages: string[] };

const STANDARD_FONTS = `${path.join(path.dirname(require.resolve('pdfjs-dist/package.json')), 'standard_fonts')}/`;

interface TextItemLike {
  str: string;
  transform: number[];
}

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');
const PDFJS = 'pdfjs-dist/legacy/build/pdf.min.mjs';
const PDFJS_PARSER = 'pdfjs-dist/legacy/build/pdf.worker.min.mjs';
let loaded: Promise<{ pdfjs: PdfJs; worker: InstanceType<PdfJs['PDFWorker']> }> | undefined;

/**
 * Loads pdfjs once per thread, with one parsing "worker" (in-thread in Node) shared by every
 * document instead of one set up per document. The parser half is loaded here too (pdfjs uses
 * globalThis.pdfjsWorker when it is set) so that both halves' polyfills are in place before the
 * fix below: core-js in the legacy build replaces Array.prototype.push with a spec-pedantic
 * JavaScript version (it only differs for arrays longer than 2³² − 1) that is about twice as
 * slow, and pdfjs's lexer pushes every character it reads, so the native one is put back.
 */
function loadPdfJs() {
  loaded ??= (async () => {
    const nativePush = Array.prototype.push;
    // The minified builds: the same code, loaded in about half the time (no source map to read).
    const pdfjs = (await import(PDFJS)) as PdfJs;
    const parser: unknown = await import(PDFJS_PARSER);
    (globalThis as { pdfjsWorker?: unknown }).pdfjsWorker = parser;
    // eslint-disable-next-line no-extend-native -- the native method put back, nothing added
    Object.defineProperty(Array.prototype, 'push', { value: nativePush, writable: true, configurable: true, enumerable: false });
    return { pdfjs, worker: new pdfjs.PDFWorker({ verbosity: 0 }) };
  })();
  return loaded;
}

/** Joins a page's text items into lines (items on the same baseline, left to right). */
export function pageLines(items: readonly TextItemLike[]): string {
  const rows = new Map<number, { x: number; s: string }[]>();
  for (const it of items) {
    if (!it.str) continue;
    const y = Math.round(it.transform[5]);
    const row = rows.get(y);
    if (row) row.push({ x: it.transform[4], s: it.str });
    else rows.set(y, [{ x: it.transform[4], s: it.str }]);
  }
  return [...rows.entries()]
    .sort((a, b) => b[0] - a[0])
    .map(([, row]) =>
      row
        .sort((a, b) => a.x - b.x)
        .map((r) => r.s)
        .join(' ')
        .replace(/\s+/g, ' ')
        .trim(),
    )
    .filter(Boolean)
    .join('\n');
}

/** Reads every page's text in this thread. An encrypted or damaged PDF is reported as unreadable, with why. */
export async function extractPdfTextInThread(data: Uint8Array): Promise<PdfText> {
  const { pdfjs, worker } = await loadPdfJs();
  let doc: Awaited<ReturnType<PdfJs['getDocument']>['promise']> | undefined;
  try {
    // pdfjs refuses a Node Buffer and detaches the memory it is given: hand it a plain view it may keep.
    const bytes = Buffer.isBuffer(data) ? new Uint8Array(data) : data;
    // Text only: no font faces, no eval'd glyph programs. Standard-font files stay available for
    // PDFs that need them to map glyphs to characters.
    doc = await pdfjs.getDocument({ data: bytes, worker, isEvalSupported: false, disableFontFace: true, standardFontDataUrl: STANDARD_FONTS, verbosity: 0 }).promise;
    const pages: string[] = [];
    for (let n = 1; n <= doc.numPages; n++) {
      const page = await doc.getPage(n);
      const content = await page.getTextContent();
      pages.push(pageLines(content.items as TextItemLike[]));
      page.cleanup();
    }
    return { status: 'read', pages };
  } catch (err) {
    const e = err as { name?: string; message?: string };
    const reason = e.name === 'PasswordException' ? 'The PDF is encrypted with a password, so its text could not be read.' : `The PDF could not be read (${e.message ?? 'damaged file'}).`;
    return { status: 'unreadable', reason, pages: [] };
  } finally {
    await doc?.destroy();
  }
}
