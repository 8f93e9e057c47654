/** Step 1, Device: the device's identity (zDeviceStep) and its grant identity, autosaved. */
import type { FilingDetail } from '../../constants/schemas/filings';
import { DeviceFields } from './device-fields';
import { DeviceIdentity, type DeviceValues } from './device-identity';
import { StepFrame } from './step-frame';
import { isObject, useStepForm } from './use-step-form';

const fromDraft = (raw: unknown, saved: DeviceValues): DeviceValues => (isObject(raw) ? ({ ...saved, ...raw } as DeviceValues) : saved);

export function DeviceStep({ filing }: { filing: FilingDetail }) {
  const stepForm = useStepForm<DeviceValues>(filing, 'device', fromDraft);
  const { form, editable } = stepForm;
  return (
    <StepFrame stepForm={stepForm} intro="Who applies, for which product, under which grant identifiers. The model number and versions appear on every exhibit.">
      <DeviceFields control={form.control} editable={editable} testIDPrefix="device" />
      <DeviceIdentity form={form} filing={filing} editable={editable} />
    </StepFrame>
  );
}
