/** Every benchmark case, in the order `npm run bench` runs them. Later issues append here. */
import type { BenchCase } from '../harness';
import { filingEvaluationCase } from './filing-evaluation';
import { planeWaveProfileCase } from './plane-wave-profile';
import { screeningCase } from './screening';
import { screeningApiCase } from './screening-api';
import { screeningPageCase } from './screening-page';
import { labImportCase, labRecomputeCase } from './lab';
import { evidenceUploadCase, readBackCase } from './evidence';
import { compareCachedCase, compareColdCase, readinessCase } from './readiness';
import { exhibitPdfCase, packageBuildCase } from './package-build';
import { healthUnderCalcCase, readsUnderCalcCase } from './calc-under-load';
import { signInFloodCase } from './sign-in-flood';
import { authenticatedReadsCase } from './authenticated-reads';

export const benchCases: BenchCase[] = [
  filingEvaluationCase,
  planeWaveProfileCase,
  screeningCase,
  screeningApiCase,
  screeningPageCase,
  labRecomputeCase,
  labImportCase,
  evidenceUploadCase,
  readBackCase,
  readinessCase,
  compareCachedCase,
  compareColdCase,
  exhibitPdfCase,
  packageBuildCase,
  healthUnderCalcCase,
  readsUnderCalcCase,
  signInFloodCase,
  authenticatedReadsCase,
];
