/** Step 1, Device: the device's identity (zDeviceStep), autosaved. */
import type { DeviceStep as DeviceValues, FilingDetail } from '../../constants/schemas/filings';
import { DeviceFields } from './device-fields';
import { StepFrame } from './step-frame';
import { isObject, useStepForm } from './use-step-form';

const fromDraft = (raw: unknown, saved: DeviceValues): DeviceValues => (isObject(raw) ? ({ ...saved, ...raw } as DeviceValues) : saved);

export function DeviceStep({ filing }: { filing: FilingDetail }) {
  const stepForm = useStepForm<DeviceValues>(filing, 'device', fromDraft);
  const { form, editable } = stepForm;
  return (
    <StepFrame stepForm={stepForm} intro="Who applies, for which product. The model number and versions appear on every exhibit.">
      <DeviceFields control={form.control} editable={editable} testIDPrefix="device" />
    </StepFrame>
  );
}
