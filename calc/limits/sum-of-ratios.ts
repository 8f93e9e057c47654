/**
 * Multiple-source exposure: the sum of each source's exposure divided by its own limit must not
 * exceed 1. 47 CFR §1.1307(b)(3)(ii)(B) (Σ Evaluated_k / ExposureLimit_k ≤ 1; wording from memory,
 * , from memory) and the ICNIRP 1998 /
 * 1999/519/EC Annex IV summation Σ S_i / S_L,i ≤ 1 for frequencies ≥ 100 kHz (1999/519/EC Annexes III–IV).
 */
import { MAX_ID_CHARS, MAX_MPE_SOURCES } from '../input-limits';
import { z } from 'zod';
import { defineCalculation, type Derivation } from '../types';
import { q } from '../types';

const SOURCE = '47 CFR §1.1307(b)(3)(ii)(B); ICNIRP 1998 / 1999/519/EC Annex IV (Σ S_i/S_L,i ≤ 1)';

export interface SourceRatio {
  id: string;
  ratio: number;
}

/** Ratios S_i/S_L,i and their sum; pass when the sum is at most 1. */
export function mpeSumOfRatios(sources: readonly { id: string; powerDensityWPerM2: number; limitWPerM2: number }[]) {
  const ratios: SourceRatio[] = sources.map((s) => ({ id: s.id, ratio: s.powerDensityWPerM2 / s.limitWPerM2 }));
  const sum = ratios.reduce((acc, r) => acc + r.ratio, 0);
  return { sum, pass: sum <= 1, ratios };
}

export const mpeSumOfRatiosInput = z.object({
  sources: z
    .array(
      z.object({
        id: z.string().min(1).max(MAX_ID_CHARS),
        powerDensityWPerM2: z.number().nonnegative().describe('Power density of this source at the point, W/m²'),
        limitWPerM2: z.number().positive().describe('This source’s own limit at its frequency, W/m²'),
      }),
    )
    .min(1)
    .max(MAX_MPE_SOURCES)
    .superRefine((list, ctx) => {
      const seen = new Set<string>();
      list.forEach((s, i) => {
        if (seen.has(s.id)) ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `duplicate source id "${s.id}"` });
        seen.add(s.id);
      });
    }),
});

export function computeMpeSumOfRatios(input: z.output<typeof mpeSumOfRatiosInput>) {
  const r = mpeSumOfRatios(input.sources);
  const derivation: Derivation = {
    formula: 'Σ S_i / S_L,i ≤ 1',
    inputs: Object.fromEntries(
      input.sources.flatMap((s) => [
        [`${s.id}.powerDensityWPerM2`, q(s.powerDensityWPerM2, 'W/m²')],
        [`${s.id}.limitWPerM2`, q(s.limitWPerM2, 'W/m²')],
      ]),
    ),
    intermediate: Object.fromEntries(r.ratios.map((x) => [`${x.id}.ratio`, q(x.ratio, '1')])),
    result: { sum: q(r.sum, '1'), pass: q(r.pass, '1') },
    source: SOURCE,
    notes: [
      'Each source is compared with the limit at its own frequency.',
      '§1.1307(b)(3)(ii)(B) also adds P/P_th and ERP/ERP_th terms of exempt sources and SAR/SAR-limit terms; its wording is from memory (47 CFR §1.1307(b)(3)(ii), from memory).',
    ],
  };
  return { ...r, derivation };
}

export const mpeSumOfRatiosCalculation = defineCalculation({
  name: 'mpe-sum-of-ratios',
  title: 'Multiple-source sum of ratios',
  description: 'Sum of each source’s power density over its own limit; compliant when at most 1.',
  input: mpeSumOfRatiosInput,
  compute: computeMpeSumOfRatios,
  sources: [SOURCE],
});
