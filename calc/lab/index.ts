import type { Calculation } from '../types';
import { liquidCheckCalculation, liquidTargetCalculation } from './liquid';
import { powerDriftCalculation } from './power-drift';
import { repeatMeasurementsCalculation } from './repeat-measurements';
import { reportedSarCalculation } from './reported-sar';
import { simultaneousTransmissionCalculation } from './simultaneous-transmission';
import { systemCheckCalculation } from './system-check';
import { uncertaintyBudgetCalculation } from './uncertainty-budget';
import { labResultsCalculation } from './lab-results';

export { reportedSar } from './reported-sar';
export { repeatMeasurements } from './repeat-measurements';
export { simultaneousTransmission } from './simultaneous-transmission';
export { uncertaintyBudget } from './uncertainty-budget';
export { liquidTarget, liquidCheck } from './liquid';
export { systemCheck } from './system-check';
export { powerDrift } from './power-drift';
export { computeLabResults, labChecks, labResultsInput, type LabCheck, type LabResults, type LabResultsInput, type LabResultsInputRaw } from './lab-results';

// Measurement-side calculations (SAR lab): reported SAR, repeats, simultaneous transmission,
// uncertainty, liquid, system check and drift.
export const labCalculations: Calculation[] = [
  reportedSarCalculation,
  repeatMeasurementsCalculation,
  simultaneousTransmissionCalculation,
  uncertaintyBudgetCalculation,
  liquidTargetCalculation,
  liquidCheckCalculation,
  systemCheckCalculation,
  powerDriftCalculation,
  labResultsCalculation,
] as Calculation[];
