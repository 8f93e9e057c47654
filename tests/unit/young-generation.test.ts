/**
 * The package build's young-generation collections: a scavenge frees dead read buffers at once,
 * the app's global scope gets no gc(), and the builder's counter asks for one each time the given
 * number of bytes has streamed.
 */
import { describe, expect, it } from 'vitest';
import { collectYoungGeneration, youngCollectionEvery } from '../../server/services/young-generation';

const arrayBuffersMb = () => process.memoryUsage().arrayBuffers / 1048576;
const nextTurn = () => new Promise((resolve) => setImmediate(resolve));

describe('young-generation collections', () => {
  it('frees dead read buffers at once', async () => {
    await nextTurn();
    collectYoungGeneration();
    const base = arrayBuffersMb();
    for (let i = 0; i < 16; i++) Buffer.allocUnsafeSlow(1 << 20).fill(i);
    // Dead, but still counted: nothing has collected them yet.
    expect(arrayBuffersMb() - base).toBeGreaterThanOrEqual(15);
    collectYoungGeneration();
    expect(arrayBuffersMb() - base).toBeLessThan(2);
    expect((globalThis as { gc?: unknown }).gc).toBeUndefined();
  });

  it('collects each time the given number of bytes has been counted', () => {
    const calls: number[] = [];
    const count = youngCollectionEvery(8, () => calls.push(calls.length));
    for (const n of [3, 3, 3, 8, 1, 1, 1, 1, 1, 1, 1, 1]) count(n);
    expect(calls).toHaveLength(3);
  });
});
