/**
 * The child process of exhibit-render.ts: takes one render request, answers with the document's
 * bytes and exits. Only the renderer it needs is loaded. It exits when its parent goes away.
 */
import type { RenderReply, RenderRequest } from './exhibit-render';

process.on('disconnect', () => process.exit(1));
process.once('message', (req: RenderRequest) => {
  const render = async (): Promise<Uint8Array> => {
    if (req.document === 'pdf') {
      // Loaded lazily so a DOCX render does not pay for the PDF stack (and the other way round).
      // eslint-disable-next-line @typescript-eslint/no-require-imports
      const { renderExhibitPdf } = require('../../templates/exhibit/pdf') as typeof import('../../templates/exhibit/pdf');
      return renderExhibitPdf(req.model, { producer: req.producer });
    }
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const { renderExhibitDocx } = require('../../templates/exhibit/docx') as typeof import('../../templates/exhibit/docx');
    return renderExhibitDocx(req.model, { producer: req.producer });
  };
  const reply = (r: RenderReply, code: number) => process.send!(r, () => process.exit(code));
  render().then(
    (bytes) => {
      const usage = process.resourceUsage();
      reply({ ok: true, bytes, maxRssMb: usage.maxRSS / 1024, cpuMs: (usage.userCPUTime + usage.systemCPUTime) / 1000 }, 0);
    },
    (err: unknown) => reply({ ok: false, error: err instanceof Error ? (err.stack ?? err.message) : String(err) }, 1),
  );
});
