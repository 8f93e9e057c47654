import type { Calculation } from '../types';
import { medium } from './medium';
import { planeWaveLayersCalculation } from './plane-wave-layers';
import { tissueProperties } from './tissue-properties';
import { units } from './units';

// Each module in this folder adds its registry entries here.
export const emCalculations: Calculation[] = [medium, tissueProperties, planeWaveLayersCalculation, units] as Calculation[];

export { planeWaveLayers } from './plane-wave-layers';
export { mediumProperties } from './medium';
export { tissueDielectric, TISSUE_IDS } from './tissue-properties';
export * from './units';
