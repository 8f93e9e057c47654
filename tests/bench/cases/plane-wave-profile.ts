/**
 * A 1000-point SAR profile through a skin / fat / muscle stack at 2.45 GHz (issue 3 benchmark:
 * under 1 ms per call), through the registry so the case follows whatever the entry does.
 */
import { getCalculation, runCalculation } from '../../../calc/registry';
import type { BenchCase } from '../harness';

const input = {
  frequencyHz: 2.45e9,
  incidentPowerDensityWPerM2: 10,
  profilePoints: 1000,
  layers: [
    { name: 'skin', thicknessM: 0.0015, tissue: 'skin-wet' },
    { name: 'fat', thicknessM: 0.005, tissue: 'fat' },
    { name: 'muscle', thicknessM: null, tissue: 'muscle' },
  ],
};

export const planeWaveProfileCase: BenchCase = {
  name: 'plane-wave-layers, 1000-point profile (3 tissue layers)',
  targetMs: 1,
  warmupIterations: 100,
  iterations: 1000,
  prepare() {
    if (!getCalculation('plane-wave-layers')) return 'plane-wave-layers is not registered yet';
    const first = runCalculation('plane-wave-layers', input);
    if (!first.ok) return `plane-wave-layers rejected the bench input: ${first.error.message}`;
    const points = (first.result as { sarProfile?: unknown[] }).sarProfile?.length;
    if (points !== undefined && points < 1000) return `profile has ${points} points, expected ≥ 1000`;
    return () => runCalculation('plane-wave-layers', input);
  },
};
