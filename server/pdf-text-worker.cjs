/**
 * The report read-back's worker thread (piscina): reads a PDF's text with pdfjs-dist, off the
 * event loop and in its own isolate (see server/services/pdf-text.ts). TypeScript is loaded
 * through tsx's require hook, as in calc-worker.cjs.
 */
require('tsx/cjs/api').register();

// Without DecompressionStream pdfjs inflates content streams with its own synchronous decoder
// instead of a web stream per stream; for text extraction (many small streams, no images
// decoded) that is about 15 % less CPU for the same text (`npm run bench -- "Read back"`).
// Only this thread's global is removed.
globalThis.DecompressionStream = undefined;

const { extractPdfTextInThread } = require('./services/pdf-text.ts');

module.exports = function readPdfText(data) {
  return extractPdfTextInThread(data);
};
