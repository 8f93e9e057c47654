/**
 * Uniform plane wave in a homogeneous, isotropic, linear medium (time convention e^(+jωt)).
 *
 *   η = √(jωμ / (σ + jωε))                          intrinsic impedance
 *   α = ω√(με/2)·[√(1 + (σ/ωε)²) − 1]^½             attenuation constant
 *   β = ω√(με/2)·[√(1 + (σ/ωε)²) + 1]^½             phase constant
 *   δ = 1/α                                          skin depth (1/e of the field amplitude)
 *   tan δ_loss = σ/(ωε)                              loss tangent
 *
 * Sources: C. A. Balanis, "Advanced Engineering Electromagnetics", 2nd ed., Wiley 2012, ch. 4
 * (plane waves in lossy media; chapter number from memory); D. M. Pozar, "Microwave Engineering",
 * 4th ed., Wiley 2012, §1.4 and Table 1.1 (section/table numbers from memory).
 */
import { z } from 'zod';
import { defineCalculation, q } from '../types';
import { complex, div, sqrt, toJson, type Complex } from './complex';
import { CONSTANTS_SOURCE, EPSILON0_F_PER_M, MU0_H_PER_M } from './constants';

export const MEDIUM_SOURCES = [
  'C. A. Balanis, Advanced Engineering Electromagnetics, 2nd ed. (Wiley, 2012), ch. 4: plane waves in lossy media (chapter from memory)',
  'D. M. Pozar, Microwave Engineering, 4th ed. (Wiley, 2012), §1.4, Table 1.1 (section from memory)',
  CONSTANTS_SOURCE,
];

export interface MediumProperties {
  /** Angular frequency ω, rad/s. */
  omegaRadPerS: number;
  /** Absolute permittivity ε = ε0·εr, F/m. */
  permittivityFPerM: number;
  /** Absolute permeability μ = μ0·μr, H/m. */
  permeabilityHPerM: number;
  /** σ/(ωε), dimensionless. */
  lossTangent: number;
  /** η, Ω. */
  intrinsicImpedanceOhm: Complex;
  /** γ = α + jβ, 1/m. */
  propagationConstantPerM: Complex;
  attenuationNpPerM: number;
  phaseRadPerM: number;
  /** 1/α, m; Infinity when the medium is lossless. */
  skinDepthM: number;
}

/**
 * Plane-wave parameters of a medium.
 * @param frequencyHz f, Hz (> 0)
 * @param relativePermittivity εr (real part of the relative permittivity), 1
 * @param conductivitySPerM σ (effective conductivity, includes dielectric loss), S/m
 * @param relativePermeability μr, 1
 */
export function mediumProperties(frequencyHz: number, relativePermittivity: number, conductivitySPerM: number, relativePermeability = 1): MediumProperties {
  const omega = 2 * Math.PI * frequencyHz;
  const eps = EPSILON0_F_PER_M * relativePermittivity;
  const mu = MU0_H_PER_M * relativePermeability;
  const x = conductivitySPerM / (omega * eps);
  const root = Math.hypot(1, x);
  const k = omega * Math.sqrt((mu * eps) / 2);
  // [√(1+x²) − 1]^½ written as x/√(√(1+x²) + 1): no cancellation or underflow in nearly lossless media.
  const alpha = (k * x) / Math.sqrt(root + 1);
  const beta = k * Math.sqrt(root + 1);
  const eta = sqrt(div(complex(0, omega * mu), complex(conductivitySPerM, omega * eps)));
  return {
    omegaRadPerS: omega,
    permittivityFPerM: eps,
    permeabilityHPerM: mu,
    lossTangent: x,
    intrinsicImpedanceOhm: eta,
    propagationConstantPerM: complex(alpha, beta),
    attenuationNpPerM: alpha,
    phaseRadPerM: beta,
    skinDepthM: alpha > 0 ? 1 / alpha : Infinity,
  };
}

export const mediumInput = z.object({
  frequencyHz: z.number().positive().describe('Frequency, Hz'),
  relativePermittivity: z.number().positive().describe('Relative permittivity εr (real part), 1'),
  conductivitySPerM: z.number().nonnegative().describe('Effective conductivity σ, S/m'),
  relativePermeability: z.number().positive().default(1).describe('Relative permeability μr, 1'),
});

export const medium = defineCalculation({
  name: 'medium',
  title: 'Plane-wave parameters of a medium',
  description: 'Intrinsic impedance, attenuation and phase constants, skin depth and loss tangent of a homogeneous medium for a uniform plane wave.',
  input: mediumInput,
  sources: MEDIUM_SOURCES,
  compute(input) {
    const { frequencyHz, relativePermittivity, conductivitySPerM, relativePermeability } = input;
    const m = mediumProperties(frequencyHz, relativePermittivity, conductivitySPerM, relativePermeability);
    const skinDepthM = Number.isFinite(m.skinDepthM) ? m.skinDepthM : null;
    const result = {
      intrinsicImpedanceOhm: toJson(m.intrinsicImpedanceOhm),
      attenuationNpPerM: m.attenuationNpPerM,
      phaseRadPerM: m.phaseRadPerM,
      skinDepthM,
      lossTangent: m.lossTangent,
    };
    return {
      ...result,
      derivation: {
        formula: 'η = √(jωμ/(σ + jωε)); α = ω√(με/2)·[√(1 + (σ/ωε)²) − 1]^½; β = ω√(με/2)·[√(1 + (σ/ωε)²) + 1]^½; δ = 1/α; tan δ = σ/(ωε)',
        inputs: {
          frequencyHz: q(frequencyHz, 'Hz'),
          relativePermittivity: q(relativePermittivity, '1'),
          conductivitySPerM: q(conductivitySPerM, 'S/m'),
          relativePermeability: q(relativePermeability, '1'),
        },
        intermediate: {
          omegaRadPerS: q(m.omegaRadPerS, 'rad/s'),
          permittivityFPerM: q(m.permittivityFPerM, 'F/m'),
          permeabilityHPerM: q(m.permeabilityHPerM, 'H/m'),
          intrinsicImpedanceMagnitudeOhm: q(Math.hypot(m.intrinsicImpedanceOhm.re, m.intrinsicImpedanceOhm.im), 'Ω'),
          intrinsicImpedanceAngleDeg: q((Math.atan2(m.intrinsicImpedanceOhm.im, m.intrinsicImpedanceOhm.re) * 180) / Math.PI, '°'),
        },
        result: {
          intrinsicImpedanceReOhm: q(m.intrinsicImpedanceOhm.re, 'Ω'),
          intrinsicImpedanceImOhm: q(m.intrinsicImpedanceOhm.im, 'Ω'),
          attenuationNpPerM: q(m.attenuationNpPerM, 'Np/m'),
          phaseRadPerM: q(m.phaseRadPerM, 'rad/m'),
          skinDepthM: q(skinDepthM, 'm'),
          lossTangent: q(m.lossTangent, '1'),
        },
        source: MEDIUM_SOURCES.join('; '),
        notes: [
          'Time convention e^(+jωt); σ is the effective conductivity (ionic plus dielectric loss), εr the real part of the relative permittivity.',
          'Skin depth is the exact 1/α (1/e of the field amplitude); the good-conductor form 1/√(πfμσ) is its σ ≫ ωε limit.',
          ...(skinDepthM === null ? ['σ = 0: the medium is lossless, α = 0 and the skin depth is unbounded (reported as null).'] : []),
        ],
      },
    };
  },
});
