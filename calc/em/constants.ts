/**
 * Physical constants for the electromagnetics modules.
 * Source: CODATA 2022 recommended values (NIST; as shipped in SciPy 1.17.1 `scipy.constants`). c is exact by SI definition.
 */

/** Speed of light in vacuum, m/s (exact, SI 2019). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;

/** Vacuum magnetic permeability μ0, N/A² (CODATA 2022). */
export const MU0_H_PER_M = 1.25663706127e-6;

/** Vacuum electric permittivity ε0, F/m (CODATA 2022). */
export const EPSILON0_F_PER_M = 8.8541878188e-12;

/** Impedance of free space Z0 = μ0·c, Ω (CODATA 2022: 376.730 313 412 Ω). */
export const FREE_SPACE_IMPEDANCE_OHM = MU0_H_PER_M * SPEED_OF_LIGHT_M_PER_S;

export const CONSTANTS_SOURCE = 'CODATA 2022 (μ0 = 1.25663706127e-6 N/A², ε0 = 8.8541878188e-12 F/m, c exact)';
