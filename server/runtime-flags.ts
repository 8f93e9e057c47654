/**
 * Process-wide V8 flags, set before anything else is loaded (server/start.ts and the bench import
 * this module first).
 *
 * --no-allocation-site-pretenuring: V8 watches where objects are allocated and, when most objects
 * from one place survive a young-generation collection, allocates that place's objects straight in
 * the old generation. A screening builds a few MB of short-lived rows, derivations and candidate
 * lists at once (480 rows for 20 transmitters × 6 positions × 4 markets); enough of them survive
 * one scavenge that V8 starts pretenuring them, and then every later evaluation fills the old
 * generation and pays for full mark-compact collections instead of cheap scavenges. Without
 * pretenuring the whole-filing evaluation takes about 40 % less time (`npm run bench`; issue 12).
 * Nothing in the app relies on long-lived objects being allocated fast.
 */
import v8 from 'node:v8';

v8.setFlagsFromString('--no-allocation-site-pretenuring');
