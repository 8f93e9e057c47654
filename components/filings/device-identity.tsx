/**
 * The Device step's grant identity: FCC ID (grantee code + product code), ISED certification
 * number (company number + UPN), HVIN, PMN and FVIN, the model variants the filing covers, and
 * whether the product is a host, a module, or a host with a certified module inside (with each
 * module's grant and conditions). Codes are typed in either case and stored as capitals.
 */
import { sourceWords } from '../source-words';
import { Controller, useFieldArray, useWatch, type Control, type UseFormReturn } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { INTEGRATIONS, INTEGRATION_LABELS } from '../../constants/schemas/device-file';
import type { DeviceStepInput, FilingDetail } from '../../constants/schemas/filings';
import { FCC_ID_SOURCE, fccIdText, granteeCodeProblem, ISED_NUMBER_SOURCE, isedCompanyNumberProblem, isedNumberText, isedUpnProblem, productCodeProblem } from '../../constants/schemas/grant-ids';
import { space } from '../../constants/theme';
import { useIsWide } from '../../hooks/use-is-wide';
import { Card } from '../ui/card';
import { ChoiceChips } from '../ui/choice-chips';
import { Text } from '../ui/text';
import { EditRows, nextId, type EditColumn } from './edit-rows';
import { FormNumber, FormText } from './form-fields';
import { useAdoptRowIds } from './use-step-form';

export type DeviceValues = DeviceStepInput;

const INTEGRATION_CHOICES = INTEGRATIONS.map((value) => ({ value, label: INTEGRATION_LABELS[value] }));

/** Two fields side by side on a wide screen, one above the other on a phone. */
function Pair({ children }: { children: React.ReactNode }) {
  const wide = useIsWide();
  return <View style={[styles.pair, wide && styles.pairWide]}>{children}</View>;
}

export function DeviceIdentity({ form, filing, editable }: { form: UseFormReturn<DeviceValues>; filing: FilingDetail; editable: boolean }) {
  const { control } = form;
  const common = { control, editable };
  const v = useWatch({ control });
  // The identifier as the label prints it, once both halves are valid.
  const code = (x: string | undefined) => (x ?? '').trim().toUpperCase();
  const [grantee, product, cn, upn] = [code(v.fccGranteeCode), code(v.fccProductCode), code(v.isedCompanyNumber), code(v.isedUpn)];
  const fccId = granteeCodeProblem(grantee) || productCodeProblem(product) ? '' : fccIdText(grantee, product);
  const icNumber = isedCompanyNumberProblem(cn) || isedUpnProblem(upn) ? '' : isedNumberText(cn, upn);
  return (
    <>
      <Card title="Grant identity">
        <View style={styles.fields}>
          <Pair>
            <Cell>
              <FormText {...common} capitals name="fccGranteeCode" label="FCC grantee code" placeholder="e.g. 2BHRW" testID="device-fccGranteeCode" />
            </Cell>
            <Cell>
              <FormText {...common} capitals name="fccProductCode" label="FCC product code" placeholder="e.g. TH4LW2" testID="device-fccProductCode" />
            </Cell>
          </Pair>
          <Text variant="small" tone="muted" testID="device-fcc-id">
            {`${fccId ? `FCC ID ${fccId}.` : 'FCC ID: grantee code (3 characters from a letter, or 5 from a digit 2–9) and product code (up to 14).'} Format: ${sourceWords(FCC_ID_SOURCE)}.`}
          </Text>
          <Pair>
            <Cell>
              <FormText {...common} capitals name="isedCompanyNumber" label="ISED company number (CN)" placeholder="e.g. 27861H" testID="device-isedCompanyNumber" />
            </Cell>
            <Cell>
              <FormText {...common} capitals name="isedUpn" label="Unique product number (UPN)" placeholder="e.g. TH4LW2" testID="device-isedUpn" />
            </Cell>
          </Pair>
          <Text variant="small" tone="muted" testID="device-ic-number">
            {`${icNumber ? `IC: ${icNumber}.` : 'ISED certification number: company number (up to 6) and UPN (up to 11).'} Format: ${sourceWords(ISED_NUMBER_SOURCE)}.`}
          </Text>
          <Pair>
            <Cell>
              <FormText {...common} name="hvin" label="HVIN (optional)" placeholder="Hardware version id" testID="device-hvin" />
            </Cell>
            <Cell>
              <FormText {...common} name="pmn" label="PMN (optional)" placeholder="Product marketing name" testID="device-pmn" />
            </Cell>
            <Cell>
              <FormText {...common} name="fvin" label="FVIN (optional)" placeholder="Firmware version id" testID="device-fvin" />
            </Cell>
          </Pair>
        </View>
      </Card>
      <ModelVariants form={form} editable={editable} />
      <Card title="Host or module">
        <Controller
          control={control}
          name="integration"
          render={({ field, fieldState }) => (
            <ChoiceChips
              label="This product is"
              choices={INTEGRATION_CHOICES}
              value={field.value ?? 'host'}
              onChange={field.onChange}
              disabled={!editable}
              error={fieldState.error?.message}
              testID="device-integration"
            />
          )}
        />
        {v.integration === 'host-with-module' || (v.modules?.length ?? 0) > 0 ? <Modules form={form} filing={filing} editable={editable} /> : null}
      </Card>
    </>
  );
}

function Cell({ children }: { children: React.ReactNode }) {
  const wide = useIsWide();
  return <View style={wide ? styles.cellWide : undefined}>{children}</View>;
}

function ModelVariants({ form, editable }: { form: UseFormReturn<DeviceValues>; editable: boolean }) {
  const { control } = form;
  const variants = useFieldArray({ control, name: 'modelVariants', keyName: 'key' });
  const values = useWatch({ control, name: 'modelVariants' }) ?? [];
  const columns: EditColumn[] = [
    {
      key: 'model',
      label: 'Model number',
      flex: 1,
      render: (i, h) => <FormText control={control} editable={editable} name={`modelVariants.${i}.model`} label="Variant model number" hideLabel={h} testID={`variant-${i}-model`} />,
    },
    {
      key: 'difference',
      label: 'How it differs from the tested model',
      flex: 2.5,
      render: (i, h) => (
        <FormText
          control={control}
          editable={editable}
          name={`modelVariants.${i}.difference`}
          label="How it differs"
          placeholder="e.g. housing colour only"
          hideLabel={h}
          testID={`variant-${i}-difference`}
        />
      ),
    },
  ];
  return (
    <Card title="Model variants covered">
      <EditRows
        noun="variant"
        columns={columns}
        count={variants.fields.length}
        keyOf={(i) => variants.fields[i].key}
        titleOf={(i) => values[i]?.model ?? ''}
        onAdd={() => variants.append({ model: '', difference: '' })}
        onRemove={(i) => variants.remove(i)}
        editable={editable}
        testID="variants"
        empty="Only the tested model. Add each other model number this filing covers."
      />
    </Card>
  );
}

function Modules({ form, filing, editable }: { form: UseFormReturn<DeviceValues>; filing: FilingDetail; editable: boolean }) {
  const { control } = form;
  const modules = useFieldArray({ control, name: 'modules', keyName: 'key' });
  const values = useWatch({ control, name: 'modules' }) ?? [];
  useAdoptRowIds(form, 'modules', filing.data.device.modules);
  const common = { control: control as Control<DeviceValues>, editable };
  const effects = (i: number) => {
    const label = values[i]?.id ?? '';
    const txs = filing.data.radios.transmitters.filter((t) => t.moduleId === label).map((t) => t.id);
    return txs.length ? [`transmitters ${txs.join(', ')} are left in no module, and its grant conditions no longer reach screening`] : [];
  };
  const columns: EditColumn[] = [
    { key: 'id', label: 'Module id', flex: 1, render: (i, h) => <FormText {...common} name={`modules.${i}.id`} label="Module id" hideLabel={h} testID={`module-${i}-id`} /> },
    { key: 'name', label: 'Maker and model', flex: 1.6, render: (i, h) => <FormText {...common} name={`modules.${i}.name`} label="Maker and model" hideLabel={h} testID={`module-${i}-name`} /> },
    {
      key: 'grantee',
      label: 'FCC grantee',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormText {...common} capitals name={`modules.${i}.fccGranteeCode`} label="FCC grantee code" hideLabel={h} testID={`module-${i}-fccGranteeCode`} />,
    },
    {
      key: 'product',
      label: 'FCC product',
      flex: 1,
      half: true,
      render: (i, h) => <FormText {...common} capitals name={`modules.${i}.fccProductCode`} label="FCC product code" hideLabel={h} testID={`module-${i}-fccProductCode`} />,
    },
    {
      key: 'cn',
      label: 'ISED CN',
      flex: 0.8,
      half: true,
      render: (i, h) => <FormText {...common} capitals name={`modules.${i}.isedCompanyNumber`} label="ISED company number" hideLabel={h} testID={`module-${i}-isedCompanyNumber`} />,
    },
    {
      key: 'upn',
      label: 'ISED UPN',
      flex: 0.9,
      half: true,
      render: (i, h) => <FormText {...common} capitals name={`modules.${i}.isedUpn`} label="ISED UPN" hideLabel={h} testID={`module-${i}-isedUpn`} />,
    },
    {
      key: 'sep',
      label: 'Min. separation (mm)',
      flex: 0.9,
      half: true,
      render: (i, h) => (
        <FormNumber {...common} optional name={`modules.${i}.minSeparationM`} label="Grant’s minimum separation" unit="mm" scale={1e-3} hideLabel={h} testID={`module-${i}-minSeparation`} />
      ),
    },
    {
      key: 'conditions',
      label: 'Other grant conditions',
      flex: 1.8,
      render: (i, h) => (
        <FormText {...common} name={`modules.${i}.conditions`} label="Other grant conditions" placeholder="e.g. antenna gain at most 3 dBi" hideLabel={h} testID={`module-${i}-conditions`} />
      ),
    },
  ];
  return (
    <View style={styles.modules}>
      <Text variant="small" tone="muted">
        Each certified module inside, with its grant. Screening warns where a use position brings a module transmitter’s antenna closer than the grant’s minimum separation; pick the module of each of
        its transmitters under Radios.
      </Text>
      <EditRows
        noun="module"
        columns={columns}
        count={modules.fields.length}
        keyOf={(i) => modules.fields[i].key}
        titleOf={(i) => values[i]?.id ?? ''}
        onAdd={() =>
          modules.append({
            id: nextId(
              'MOD',
              values.map((m) => m?.id ?? ''),
            ),
            name: '',
            fccGranteeCode: '',
            fccProductCode: '',
            isedCompanyNumber: '',
            isedUpn: '',
            conditions: '',
          })
        }
        onRemove={(i) => modules.remove(i)}
        removalEffects={effects}
        editable={editable}
        testID="modules"
        empty="No module grants yet. Add the certified module inside."
      />
    </View>
  );
}

const styles = StyleSheet.create({
  fields: { gap: space.md },
  pair: { gap: space.md },
  pairWide: { flexDirection: 'row', columnGap: space.lg },
  cellWide: { flex: 1, minWidth: 0 },
  modules: { gap: space.md, paddingTop: space.md },
});
