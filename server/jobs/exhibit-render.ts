/**
 * Renders the exhibit's PDF or DOCX in a child process of its own. Rendering is CPU work of a
 * second or more and holds the document in memory; in a child it neither blocks the server's
 * event loop nor adds to the server's memory, and the package builder streams the evidence into
 * the zip while it runs. The child gets the model (plain data) and answers with the bytes; the
 * same model gives the same bytes as rendering in process.
 */
import { fork } from 'node:child_process';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { ExhibitModel } from '../../templates/exhibit/model';

export type ExhibitDocument = 'pdf' | 'docx';

export interface RenderRequest {
  document: ExhibitDocument;
  model: ExhibitModel;
  producer: string;
}

export type RenderReply = { ok: true; bytes: Uint8Array; maxRssMb: number; cpuMs: number } | { ok: false; error: string };

export interface Rendered {
  bytes: Buffer;
  /** The child's peak resident memory (for the bench). */
  maxRssMb: number;
  /** The child's CPU time, user + system, start-up included (for the bench). */
  cpuMs: number;
}

const ext = path.extname(__filename);
const CHILD = path.join(__dirname, `exhibit-render-child${ext}`);
/** Under tsx (TypeScript sources) the child loads them with tsx's require hook: no loader thread. */
const execArgv = ext === '.ts' ? ['--require', createRequire(__filename).resolve('tsx/cjs')] : [];

/** Renders one document of the exhibit in a child process; `signal` kills the child. */
export function renderInChild(document: ExhibitDocument, model: ExhibitModel, producer: string, signal?: AbortSignal): Promise<Rendered> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(signal.reason);
    const child = fork(CHILD, [], { execArgv, serialization: 'advanced', stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
    let settled = false;
    const settle = (fn: () => void) => {
      if (settled) return;
      settled = true;
      signal?.removeEventListener('abort', abort);
      fn();
    };
    const abort = () => {
      child.kill('SIGKILL');
      settle(() => reject(signal!.reason));
    };
    signal?.addEventListener('abort', abort, { once: true });
    child.on('message', (reply: RenderReply) =>
      settle(() =>
        reply.ok
          ? resolve({ bytes: Buffer.from(reply.bytes.buffer, reply.bytes.byteOffset, reply.bytes.byteLength), maxRssMb: reply.maxRssMb, cpuMs: reply.cpuMs })
          : reject(new Error(`Rendering the exhibit ${document.toUpperCase()} failed: ${reply.error}`)),
      ),
    );
    child.on('error', (err) => settle(() => reject(err)));
    child.on('exit', (code, sig) => settle(() => reject(new Error(`The exhibit ${document.toUpperCase()} renderer stopped (${sig ?? `exit ${code}`}).`))));
    child.send({ document, model, producer } satisfies RenderRequest);
  });
}
