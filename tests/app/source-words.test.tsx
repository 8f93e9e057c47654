/**
 * Provenance in a careful lab's words: the engine's "from memory" and "secondary source" remarks
 * (kept in the data for its authors) reach the screen as the clause plus "check against the
 * current edition" / "check against the published text", never as the remark itself (every
 * such string of the engine is swept in tests/server/source-words-sweep.test.ts).
 */
import { sourceWords } from '../../components/source-words';

describe('source words', () => {
  it('rewrites the typical remarks as a lab would say them', () => {
    expect(sourceWords('RSS-102 Issue 5 §2.5.1 Table 1, from memory')).toBe('RSS-102 Issue 5 §2.5.1 Table 1; check against the current edition');
    expect(sourceWords('Limb-worn: Table 1 × 2.5 (RSS-102 Issue 5 §2.5.1 Table 1, from memory).')).toBe(
      'Limb-worn: Table 1 × 2.5 (RSS-102 Issue 5 §2.5.1 Table 1; check against the current edition).',
    );
    expect(sourceWords('Table values other than 2450 MHz are from memory: verify before release.')).toBe('Table values other than 2450 MHz are to be checked against the current edition.');
    expect(sourceWords('ISED RSP-100 (certification number CN-UPN; clause from memory)')).toBe('ISED RSP-100 (certification number CN-UPN; check against the current edition)');
    expect(sourceWords('Formula transcribed from secondary sources; checked against 2.72 mW.')).toBe(
      'Formula as reproduced in secondary references; check against the published text; checked against 2.72 mW.',
    );
    expect(sourceWords('H from memory (ICNIRP 1998 Table 6); S_eq confirmed from a secondary source.')).toBe(
      'H (ICNIRP 1998 Table 6; check against the current edition); S_eq confirmed in a secondary reference; check against the published text.',
    );
    // Text without such a remark is left as it is.
    expect(sourceWords('47 CFR §1.1310 Table 1')).toBe('47 CFR §1.1310 Table 1');
  });
});
