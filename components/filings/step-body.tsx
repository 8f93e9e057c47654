/** The body of one wizard step: its form, or what it computes (the review page shows each of them to read). */
import type { FilingDetail, WizardStep } from '../../constants/schemas/filings';
import { CoTransmissionView } from './co-transmission-view';
import { DeviceStep } from './device-step';
import { EvidenceStep } from './evidence-step';
import { LabView } from './lab-view';
import { MarketsStep } from './markets-step';
import { RadiosStep } from './radios-step';
import { ScreeningView } from './screening-view';
import { UsePositionsStep } from './use-positions-step';

export function StepBody({ filing, step }: { filing: FilingDetail; step: WizardStep }) {
  switch (step) {
    case 'device':
      return <DeviceStep filing={filing} />;
    case 'radios':
      return <RadiosStep filing={filing} />;
    case 'use-positions':
      return <UsePositionsStep filing={filing} />;
    case 'markets':
      return <MarketsStep filing={filing} />;
    case 'screening':
      return <ScreeningView filing={filing} />;
    case 'measurements':
      return <LabView filing={filing} />;
    case 'co-transmission':
      return <CoTransmissionView filing={filing} />;
    case 'evidence':
      return <EvidenceStep filing={filing} />;
  }
}
