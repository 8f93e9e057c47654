/**
 * archiver takes each zip entry's CRC-32 (which the zip format requires) from the crc-32 package,
 * in JavaScript: for a package with a gigabyte of evidence that was the build's largest CPU cost.
 * zlib.crc32 (Node ≥ 20.15) computes the same checksum natively, several times faster. This
 * points crc-32's buffer function at it, once, and only after both give the same values.
 */
import { createRequire } from 'node:module';
import zlib from 'node:zlib';

interface Crc32Module {
  buf(data: Uint8Array, seed?: unknown): number;
}

let done = false;

export function useNativeCrc32(): void {
  if (done || typeof zlib.crc32 !== 'function') return;
  done = true;
  const crc = createRequire(__filename)('crc-32') as Crc32Module;
  const original = crc.buf;
  // crc-32 returns a signed 32-bit value and takes the running value as its seed (a seed that is
  // not a number counts as 0, as crc32-stream's first call passes a Buffer).
  const native = (data: Uint8Array, seed?: unknown) => zlib.crc32(data, typeof seed === 'number' ? seed >>> 0 : 0) | 0;
  const sample = Buffer.from(Array.from({ length: 4099 }, (_, i) => (i * 131 + 7) & 0xff));
  const agree = [undefined, 0, -1, 123456789].every((seed) => native(sample, seed) === original(sample, seed as number));
  if (agree) crc.buf = native;
}
