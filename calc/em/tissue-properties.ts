/**
 * Dielectric properties of body tissues from the four-term Cole-Cole model (time convention e^(+jωt)):
 *
 *   ε̂(ω) = ε∞ + Σ_{n=1..4} Δε_n / (1 + (jωτ_n)^(1−α_n)) + σ_i/(jωε0)
 *   εr = Re ε̂ ;  σ = −ωε0·Im ε̂
 *
 * Source: S. Gabriel, R. W. Lau, C. Gabriel, "The dielectric properties of biological tissues: III.
 * Parametric models for the dielectric spectrum of tissues", Phys. Med. Biol. 41 (1996) 2271–2293,
 * eq. and parameter table; CSF and dura from C. Gabriel, Brooks AFB report AL/OE-TR-1996-0037,
 * Appendix C (IFAC-CNR on-line copy). The model's range is 10 Hz–100 GHz.
 * Mass densities: IT'IS tissue database v4.x averages.
 */
import { z } from 'zod';
import { CalcRangeError, defineCalculation, q } from '../types';
import { add, complex, div, powReal, type Complex } from './complex';
import { CONSTANTS_SOURCE, EPSILON0_F_PER_M } from './constants';

export const COLE_COLE_MIN_FREQUENCY_HZ = 10;
export const COLE_COLE_MAX_FREQUENCY_HZ = 100e9;

export const TISSUE_IDS = ['skin-dry', 'skin-wet', 'fat', 'bone-cortical', 'bone-cancellous', 'brain-grey-matter', 'brain-white-matter', 'csf', 'muscle', 'blood', 'dura'] as const;

export type TissueId = (typeof TISSUE_IDS)[number];

interface Dispersion {
  deltaEpsilon: number;
  tauS: number;
  alpha: number;
}

interface TissueEntry {
  label: string;
  epsilonInf: number;
  ionicConductivitySPerM: number;
  dispersions: [Dispersion, Dispersion, Dispersion, Dispersion];
  densityKgPerM3: number;
  densitySource: string;
  parameterSource: string;
  notes: string[];
}

const PMB_1996 = 'Gabriel, Lau & Gabriel 1996, Phys. Med. Biol. 41:2271, Cole-Cole parameter table';
const APPENDIX_C = 'C. Gabriel 1996, report AL/OE-TR-1996-0037, Appendix C (IFAC-CNR copy)';
const ITIS = "IT'IS tissue database v4.x average density";

/** τ columns of the table: τ1 ps, τ2 ns, τ3 µs, τ4 ms. */
function row(
  label: string,
  epsilonInf: number,
  p: [number, number, number, number, number, number, number, number, number, number, number, number, number],
  densityKgPerM3: number,
  extra: Partial<Pick<TissueEntry, 'densitySource' | 'parameterSource' | 'notes'>> = {},
): TissueEntry {
  const [de1, t1, a1, de2, t2, a2, sigmaI, de3, t3, a3, de4, t4, a4] = p;
  return {
    label,
    epsilonInf,
    ionicConductivitySPerM: sigmaI,
    dispersions: [
      { deltaEpsilon: de1, tauS: t1 * 1e-12, alpha: a1 },
      { deltaEpsilon: de2, tauS: t2 * 1e-9, alpha: a2 },
      { deltaEpsilon: de3, tauS: t3 * 1e-6, alpha: a3 },
      { deltaEpsilon: de4, tauS: t4 * 1e-3, alpha: a4 },
    ],
    densityKgPerM3,
    densitySource: extra.densitySource ?? ITIS,
    parameterSource: extra.parameterSource ?? PMB_1996,
    notes: extra.notes ?? [],
  };
}

const SKIN_SIGMA_NOTE =
  "σ_i of skin is printed 0.000 in the IFAC table; 0.0002 (dry) / 0.0004 (wet) S/m from a public table citing IFAC and IT'IS (Gabriel, Lau & Gabriel 1996 Cole-Cole parameter table) — below 0.03 % effect at RF.";

//                   Δε1   τ1(ps)  α1    Δε2   τ2(ns)   α2    σi      Δε3     τ3(µs)   α3    Δε4     τ4(ms)  α4
export const TISSUES: Record<TissueId, TissueEntry> = {
  'skin-dry': row('Skin (Dry)', 4, [32, 7.234, 0.0, 1100, 32.481, 0.2, 0.0002, 0, 159.155, 0.2, 0, 15.915, 0.2], 1109, { notes: [SKIN_SIGMA_NOTE] }),
  'skin-wet': row('Skin (Wet)', 4, [39, 7.958, 0.1, 280, 79.577, 0.0, 0.0004, 3.0e4, 1.592, 0.16, 3.0e4, 1.592, 0.2], 1109, { notes: [SKIN_SIGMA_NOTE] }),
  fat: row('Fat (Not Infiltrated)', 2.5, [3, 7.958, 0.2, 15, 15.915, 0.1, 0.01, 3.3e4, 159.155, 0.05, 1.0e7, 7.958, 0.01], 911),
  'bone-cortical': row('Bone (Cortical)', 2.5, [10, 13.263, 0.2, 180, 79.577, 0.2, 0.02, 5000, 159.155, 0.2, 1.0e5, 15.915, 0.0], 1908),
  'bone-cancellous': row('Bone (Cancellous)', 2.5, [18, 13.263, 0.22, 300, 79.577, 0.25, 0.07, 2.0e4, 159.155, 0.2, 2.0e7, 15.915, 0.0], 1178),
  'brain-grey-matter': row('Brain (Grey Matter)', 4, [45, 7.958, 0.1, 400, 15.915, 0.15, 0.02, 2.0e5, 106.103, 0.22, 4.5e7, 5.305, 0.0], 1045),
  'brain-white-matter': row('Brain (White Matter)', 4, [32, 7.958, 0.1, 100, 7.958, 0.1, 0.02, 4.0e4, 53.052, 0.3, 3.5e7, 7.958, 0.02], 1041),
  csf: row('Cerebro Spinal Fluid', 4, [65, 7.958, 0.1, 40, 1.592, 0.0, 2, 0, 159.155, 0.0, 0, 15.915, 0.0], 1007, { parameterSource: APPENDIX_C }),
  muscle: row('Muscle', 4, [50, 7.234, 0.1, 7000, 353.678, 0.1, 0.2, 1.2e6, 318.31, 0.1, 2.5e7, 2.274, 0.0], 1090),
  blood: row('Blood', 4, [56, 8.377, 0.1, 5200, 132.629, 0.1, 0.7, 0, 159.155, 0.2, 0, 15.915, 0.0], 1050),
  dura: row('Dura', 4, [40, 7.958, 0.15, 200, 7.958, 0.1, 0.5, 1.0e4, 159.155, 0.2, 1.0e6, 15.915, 0.0], 1174, {
    parameterSource: APPENDIX_C,
    densitySource: "1174 kg/m³, from memory (IT'IS-style value; not confirmed)",
  }),
};

export interface TissueDielectric {
  relativePermittivity: number;
  conductivitySPerM: number;
  densityKgPerM3: number;
  /** ε̂ = εr − jσ/(ωε0). */
  complexRelativePermittivity: Complex;
}

/** Throws CalcRangeError outside the model's 10 Hz–100 GHz range. */
export function assertColeColeRange(frequencyHz: number, path: (string | number)[] = ['frequencyHz']): void {
  if (!(frequencyHz >= COLE_COLE_MIN_FREQUENCY_HZ && frequencyHz <= COLE_COLE_MAX_FREQUENCY_HZ)) {
    const message = `frequencyHz ${frequencyHz} is outside the Gabriel 1996 Cole-Cole model's range, 10 Hz to 100 GHz (1e1–1e11 Hz)`;
    throw new CalcRangeError(message, [{ path, message }]);
  }
}

/**
 * εr, σ (S/m) and density (kg/m³) of a tissue at frequencyHz (Hz), Gabriel 1996 four-term Cole-Cole.
 */
export function tissueDielectric(tissue: TissueId, frequencyHz: number): TissueDielectric {
  assertColeColeRange(frequencyHz);
  const t = TISSUES[tissue];
  const omega = 2 * Math.PI * frequencyHz;
  let eps: Complex = complex(t.epsilonInf + 0, -t.ionicConductivitySPerM / (omega * EPSILON0_F_PER_M));
  for (const d of t.dispersions) {
    if (d.deltaEpsilon === 0) continue;
    const denom = add(complex(1, 0), powReal(complex(0, omega * d.tauS), 1 - d.alpha));
    eps = add(eps, div(complex(d.deltaEpsilon, 0), denom));
  }
  return {
    relativePermittivity: eps.re,
    conductivitySPerM: -omega * EPSILON0_F_PER_M * eps.im,
    densityKgPerM3: t.densityKgPerM3,
    complexRelativePermittivity: eps,
  };
}

export const tissueIdSchema = z.enum(TISSUE_IDS).describe(`Tissue id: ${TISSUE_IDS.join(', ')}`);

export const tissuePropertiesInput = z.object({
  tissue: tissueIdSchema,
  frequencyHz: z.number().positive().describe('Frequency, Hz (10 Hz – 100 GHz)'),
});

export const TISSUE_SOURCES = [
  'S. Gabriel, R. W. Lau, C. Gabriel, Phys. Med. Biol. 41 (1996) 2271–2293: four-term Cole-Cole model and parameters',
  'C. Gabriel, Compilation of the dielectric properties of body tissues at RF and microwave frequencies, AL/OE-TR-1996-0037, Appendix C (CSF, dura)',
  "IT'IS Foundation tissue properties database v4.x: mass densities",
  CONSTANTS_SOURCE,
];

export const tissueProperties = defineCalculation({
  name: 'tissue-properties',
  title: 'Tissue permittivity, conductivity and density',
  description: `Relative permittivity and conductivity of a body tissue from the Gabriel 1996 four-term Cole-Cole model (10 Hz–100 GHz), with its mass density. Tissues: ${TISSUE_IDS.join(', ')}.`,
  input: tissuePropertiesInput,
  sources: TISSUE_SOURCES,
  compute({ tissue, frequencyHz }) {
    const t = TISSUES[tissue];
    const r = tissueDielectric(tissue, frequencyHz);
    const [d1, d2, d3, d4] = t.dispersions;
    return {
      relativePermittivity: r.relativePermittivity,
      conductivitySPerM: r.conductivitySPerM,
      densityKgPerM3: r.densityKgPerM3,
      derivation: {
        formula: 'ε̂ = ε∞ + Σ_{n=1..4} Δε_n/(1 + (jωτ_n)^(1−α_n)) + σ_i/(jωε0); εr = Re ε̂; σ = −ωε0·Im ε̂',
        inputs: {
          tissue: q(tissue, 'id'),
          frequencyHz: q(frequencyHz, 'Hz'),
          epsilonInf: q(t.epsilonInf, '1'),
          ionicConductivitySPerM: q(t.ionicConductivitySPerM, 'S/m'),
          ...Object.fromEntries(
            [d1, d2, d3, d4].flatMap((d, i) => [
              [`deltaEpsilon${i + 1}`, q(d.deltaEpsilon, '1')],
              [`tau${i + 1}S`, q(d.tauS, 's')],
              [`alpha${i + 1}`, q(d.alpha, '1')],
            ]),
          ),
        },
        intermediate: {
          omegaRadPerS: q(2 * Math.PI * frequencyHz, 'rad/s'),
          complexPermittivityRe: q(r.complexRelativePermittivity.re, '1'),
          complexPermittivityIm: q(r.complexRelativePermittivity.im, '1'),
        },
        result: {
          relativePermittivity: q(r.relativePermittivity, '1'),
          conductivitySPerM: q(r.conductivitySPerM, 'S/m'),
          densityKgPerM3: q(r.densityKgPerM3, 'kg/m³'),
        },
        source: `${t.parameterSource} (${t.label}); density: ${t.densitySource}`,
        notes: ['Valid 10 Hz–100 GHz (range of the fitted data); τ1 in ps, τ2 in ns, τ3 in µs, τ4 in ms in the published table.', ...t.notes],
      },
    };
  },
});
