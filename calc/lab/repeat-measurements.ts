/**
 * Repeated SAR measurements: how many repeats a configuration needs.
 *
 * Source: FCC KDB 865664 D01 v01r04 §2.8.1 (clause number from memory), rule as given in
 * FCC KDB 865664 D01 v01r04 (from memory):
 *   1) original highest measured SAR < 0.80 W/kg → no repeat;
 *   2) ≥ 0.80 W/kg → repeat once;
 *   3) second repeat if largest/smallest of original and first repeat > 1.20, or any of them ≥ 1.45 W/kg;
 *   4) third repeat if any of the three ≥ 1.5 W/kg and largest/smallest of the three > 1.20.
 * Thresholds are for 1-g SAR; the KDB scales them ×2.5 for 10-g extremity and ×5 for occupational
 * exposure (reference flags this scaling "unsure").
 */
import { z } from 'zod';
import { defineCalculation, type WithDerivation } from '../types';
import { plainFunction } from './plain-function';
import { q } from '../types';

/** KDB 865664 D01 1-g thresholds, W/kg [from memory]. */
const BASE_THRESHOLDS_W_PER_KG = { firstRepeat: 0.8, secondRepeat: 1.45, thirdRepeat: 1.5 } as const;
/** Largest/smallest ratio above which repeats disagree (KDB 865664 D01) [from memory]. */
export const REPEAT_RATIO_LIMIT = 1.2;
/** Scaling of the thresholds per exposure category (KDB 865664 D01) [from memory, unsure]. */
const CATEGORY_FACTOR = { 'general-1g': 1, 'extremity-10g': 2.5, 'occupational-1g': 5 } as const;

export const repeatMeasurementsInput = z.object({
  sarWPerKg: z.array(z.number().positive()).min(1).max(4).describe('SAR values in order: original highest measured SAR, then repeats done so far (W/kg)'),
  exposure: z.enum(['general-1g', 'extremity-10g', 'occupational-1g']).default('general-1g').describe('Exposure category; scales the 1-g thresholds ×1, ×2.5, ×5'),
});

export interface RepeatMeasurementsResult {
  /** Repeats required as far as the values given decide it (0–3). */
  repeatsRequired: number;
  repeatsDone: number;
  /** True when the values given settle the count; false when a further repeat's value is needed first. */
  decided: boolean;
  /** True when another repeat must still be measured. */
  nextRepeatRequired: boolean;
  why: string[];
  thresholdsWPerKg: { firstRepeat: number; secondRepeat: number; thirdRepeat: number };
}

const ratio = (values: number[]) => Math.max(...values) / Math.min(...values);
const fmt = (x: number) => Number(x.toFixed(4)).toString();

export function computeRepeatMeasurements(input: z.output<typeof repeatMeasurementsInput>): WithDerivation<RepeatMeasurementsResult> {
  const { sarWPerKg: values, exposure } = input;
  const factor = CATEGORY_FACTOR[exposure];
  const t = {
    firstRepeat: BASE_THRESHOLDS_W_PER_KG.firstRepeat * factor,
    secondRepeat: BASE_THRESHOLDS_W_PER_KG.secondRepeat * factor,
    thirdRepeat: BASE_THRESHOLDS_W_PER_KG.thirdRepeat * factor,
  };
  const why: string[] = [];
  const intermediate: Record<string, ReturnType<typeof q>> = {};
  const [original] = values;
  let repeatsRequired = 0;
  let decided = true;

  if (original < t.firstRepeat) {
    why.push(`Original SAR ${fmt(original)} W/kg < ${fmt(t.firstRepeat)} W/kg: no repeat required (step 1).`);
  } else {
    repeatsRequired = 1;
    why.push(`Original SAR ${fmt(original)} W/kg ≥ ${fmt(t.firstRepeat)} W/kg: repeat once (step 2).`);
    if (values.length < 2) {
      decided = false;
      why.push('Whether a second repeat is needed depends on the first repeat.');
    } else {
      const two = values.slice(0, 2);
      const r2 = ratio(two);
      intermediate.ratioOriginalFirstRepeat = q(r2, '1');
      const over145 = two.some((v) => v >= t.secondRepeat);
      if (r2 > REPEAT_RATIO_LIMIT || over145) {
        repeatsRequired = 2;
        why.push(
          `Second repeat required (step 3): largest/smallest of original and first repeat = ${fmt(r2)}` +
            `${r2 > REPEAT_RATIO_LIMIT ? ` > ${REPEAT_RATIO_LIMIT}` : ''}` +
            `${over145 ? `; a value ≥ ${fmt(t.secondRepeat)} W/kg` : ''}.`,
        );
        if (values.length < 3) {
          decided = false;
          why.push('Whether a third repeat is needed depends on the second repeat.');
        } else {
          const three = values.slice(0, 3);
          const r3 = ratio(three);
          intermediate.ratioOfThree = q(r3, '1');
          const over15 = three.some((v) => v >= t.thirdRepeat);
          if (over15 && r3 > REPEAT_RATIO_LIMIT) {
            repeatsRequired = 3;
            why.push(`Third repeat required (step 4): a value ≥ ${fmt(t.thirdRepeat)} W/kg and largest/smallest of the three = ${fmt(r3)} > ${REPEAT_RATIO_LIMIT}.`);
          } else {
            const reasons = [...(over15 ? [] : [`no value ≥ ${fmt(t.thirdRepeat)} W/kg`]), ...(r3 <= REPEAT_RATIO_LIMIT ? [`largest/smallest of the three = ${fmt(r3)} ≤ ${REPEAT_RATIO_LIMIT}`] : [])];
            why.push(`No third repeat (step 4): ${reasons.join(' and ')}.`);
          }
        }
      } else {
        why.push(`No second repeat (step 3): largest/smallest = ${fmt(r2)} ≤ ${REPEAT_RATIO_LIMIT} and both values < ${fmt(t.secondRepeat)} W/kg.`);
      }
    }
  }

  const repeatsDone = values.length - 1;
  if (repeatsDone > repeatsRequired && decided) {
    why.push(`${repeatsDone} repeat(s) given; only ${repeatsRequired} required — the extra values were not needed by the rule.`);
  }
  const nextRepeatRequired = repeatsDone < repeatsRequired;

  return {
    repeatsRequired,
    repeatsDone,
    decided,
    nextRepeatRequired,
    why,
    thresholdsWPerKg: t,
    derivation: {
      formula: 'repeat once if SAR_orig ≥ T1; second if max/min(orig, r1) > 1.20 or any ≥ T2; third if any of (orig, r1, r2) ≥ T3 and max/min > 1.20',
      inputs: {
        sarWPerKg: q(values.join(', '), 'W/kg'),
        exposure: q(exposure, 'category'),
      },
      intermediate: {
        thresholdFactor: q(factor, '1'),
        T1: q(t.firstRepeat, 'W/kg'),
        T2: q(t.secondRepeat, 'W/kg'),
        T3: q(t.thirdRepeat, 'W/kg'),
        ...intermediate,
      },
      result: {
        repeatsRequired: q(repeatsRequired, 'count'),
        decided: q(decided, 'boolean'),
        nextRepeatRequired: q(nextRepeatRequired, 'boolean'),
      },
      source: 'FCC KDB 865664 D01 v01r04 §2.8.1 repeated SAR measurements (from memory; verify against the KDB)',
      notes: [
        'Thresholds 0.80 / 1.45 / 1.5 W/kg and ratio 1.20 are from memory (FCC KDB 865664 D01 v01r04, from memory).',
        ...(factor !== 1 ? [`Thresholds scaled ×${factor} for ${exposure} (KDB 865664 D01; from memory, unsure).`] : []),
        'The first value is the original highest measured SAR of the band/configuration.',
      ],
    },
  };
}

export type RepeatMeasurementsInput = z.input<typeof repeatMeasurementsInput>;

/** Plain function for the server: validates (applying defaults) and computes. */
export const repeatMeasurements = plainFunction(repeatMeasurementsInput, computeRepeatMeasurements);

export const repeatMeasurementsCalculation = defineCalculation({
  name: 'repeat-measurements',
  title: 'Repeated SAR measurements required',
  description: 'KDB 865664 D01 repeat rule: given the original highest SAR and any repeats so far, how many repeats are required and why.',
  input: repeatMeasurementsInput,
  compute: computeRepeatMeasurements,
  sources: ['FCC KDB 865664 D01 v01r04 §2.8.1'],
});
