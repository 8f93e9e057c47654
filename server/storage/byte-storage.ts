/**
 * The one interface for stored bytes (evidence files, built packages). Objects are addressed by
 * the SHA-256 of their content, so the same bytes are stored once and a database row only keeps
 * the hash. Local disk implements it today (local-disk.ts); an S3-compatible bucket can replace it
 * without anything else in the code knowing where bytes live.
 */
import type { Readable } from 'node:stream';

export interface StoredObject {
  /** Lower-case hex SHA-256 of the content; the object's key. */
  sha256: string;
  sizeBytes: number;
  /** The first bytes of the content (up to HEAD_BYTES), for sniffing the type. */
  head: Buffer;
  /** True when the same content was already stored (nothing new was written). */
  alreadyStored: boolean;
}

/** How many leading bytes `put` hands to `accept` and returns (enough for file-type). */
export const HEAD_BYTES = 4100;

export interface PutOptions {
  /** Refuse (and keep nothing of) a stream longer than this. */
  maxBytes?: number;
  /**
   * Called once the whole stream is written to a temporary place and hashed, before it becomes
   * visible under its hash. Throwing (or rejecting) aborts the put and removes the temporary copy.
   */
  accept?(object: Omit<StoredObject, 'alreadyStored'>): void | Promise<void>;
}

export interface ByteStorage {
  /** Streams `source` into storage while hashing it; resolves once it is durably in place. */
  put(source: Readable, options?: PutOptions): Promise<StoredObject>;
  /**
   * A stream of the stored bytes; rejects with ObjectNotFoundError when there is none.
   * `chunkBytes` is the size of each read (the package build streams up to gigabytes through in
   * larger reads; the default suits downloads and sniffing). A hint: a bucket streams what the network delivers.
   */
  get(sha256: string, options?: { chunkBytes?: number }): Promise<Readable>;
  exists(sha256: string): Promise<boolean>;
  /** Size in bytes, or undefined when absent. */
  size(sha256: string): Promise<number | undefined>;
  /** Removes the object; absent objects are ignored. */
  delete(sha256: string): Promise<void>;
  /**
   * Removes left-over temporary files and every object whose hash `isReferenced` denies (bytes
   * whose database row was never written, e.g. after a crash). Objects younger than
   * `minAgeMs` are kept so an upload in flight on another process is not swept.
   */
  sweepOrphans(isReferenced: (sha256: string) => boolean, options?: { minAgeMs?: number }): Promise<SweepReport>;
}

export interface SweepReport {
  removedObjects: string[];
  removedTemporaryFiles: number;
}

export class ObjectNotFoundError extends Error {
  constructor(readonly sha256: string) {
    super(`No stored object ${sha256}.`);
    this.name = 'ObjectNotFoundError';
  }
}

/** The stream was longer than PutOptions.maxBytes; nothing was kept. */
export class ObjectTooLargeError extends Error {
  constructor(readonly maxBytes: number) {
    super(`The content is larger than ${maxBytes} bytes.`);
    this.name = 'ObjectTooLargeError';
  }
}

export const isSha256 = (s: string) => /^[0-9a-f]{64}$/.test(s);
