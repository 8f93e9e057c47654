/** /filings/new: start a filing from the device's identity, or import a device description file. */
import { zodResolver } from '@hookform/resolvers/zod';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { zNewFiling, type NewFilingInput } from '../../constants/schemas/filings';
import { space } from '../../constants/theme';
import { useCreateFilingMutation } from '../../hooks/queries/filings';
import { hasRole, useCurrentUser } from '../../hooks/queries/session';
import { applyServerErrors } from '../../hooks/use-server-errors';
import { DeviceFields } from '../filings/device-fields';
import { ImportDeviceFile } from '../filings/import-device-file';
import { Screen } from '../layout/screen';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { ChoiceChips } from '../ui/choice-chips';
import { Notice } from '../ui/notice';

const FIELDS = ['device.name', 'device.model', 'device.applicant', 'device.productType', 'device.hardwareVersion', 'device.firmwareVersion'] as const;
type Mode = 'new' | 'import';

export function FilingNewScreen() {
  const user = useCurrentUser();
  const params = useLocalSearchParams<{ import?: string }>();
  const [mode, setMode] = useState<Mode>(params.import ? 'import' : 'new');
  if (!hasRole(user, 'specialist')) {
    return (
      <Screen title="New filing" testID="filing-new-screen">
        <Notice tone="caution" title="Only a compliance specialist starts filings">
          You can read every filing of your organisation from the list.
        </Notice>
      </Screen>
    );
  }
  return (
    <Screen eyebrow="Filings" title="New filing" subtitle="Start with the device; radios, use positions and markets follow step by step." testID="filing-new-screen">
      <ChoiceChips
        label="How to start"
        choices={[
          { value: 'new', label: 'Type in the device' },
          { value: 'import', label: 'Import a device file' },
        ]}
        value={mode}
        onChange={setMode}
        testID="new-mode"
      />
      {mode === 'new' ? (
        <Card title="Device">
          <NewFilingForm />
        </Card>
      ) : (
        <Card title="Import a device file">
          <ImportDeviceFile />
        </Card>
      )}
    </Screen>
  );
}

function NewFilingForm() {
  const router = useRouter();
  const create = useCreateFilingMutation();
  const form = useForm<NewFilingInput>({
    resolver: zodResolver(zNewFiling),
    defaultValues: { device: { name: '', model: '', applicant: '', productType: undefined as never, hardwareVersion: '', firmwareVersion: '' } },
  });
  const rootError = form.formState.errors.root?.server?.message;
  const submit = form.handleSubmit(async (values) => {
    try {
      const filing = await create.mutateAsync(values);
      router.replace(`/filings/${filing.id}/radios`);
    } catch (error) {
      applyServerErrors(error, form.setError, FIELDS);
    }
  });
  return (
    <View style={{ gap: space.lg }} testID="new-filing-form">
      <DeviceFields control={form.control} prefix="device." testIDPrefix="new-device" onSubmit={() => void submit()} />
      {rootError ? <Notice tone="error">{rootError}</Notice> : null}
      <Button
        label="Create filing and add radios"
        icon="chevronRight"
        onPress={() => void submit()}
        busy={create.isPending}
        busyLabel="Creating…"
        testID="new-filing-submit"
        style={{ alignSelf: 'flex-start' }}
      />
    </View>
  );
}
