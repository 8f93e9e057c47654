/**
 * Which transmitters can be on together, per use position: groups that hold in every use position
 * (the device file's list) and groups of one position only, each a set of ticked transmitters.
 * The specialist edits (the role that edits the device data); every other role reads. Saved whole
 * with Save; the sums below recompute.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { Controller, useFieldArray, useForm, useWatch, type Resolver } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { zCoTransmissionBody, type CoTransmissionGroup } from '../../constants/schemas/co-transmission';
import { USE_POSITION_LABELS } from '../../constants/schemas/device-file';
import type { FilingDetail } from '../../constants/schemas/filings';
import { palette, space } from '../../constants/theme';
import { filingKeys } from '../../hooks/queries/filings';
import { coTransmissionKey, labKeys, saveCoTransmission, staleCoTransmission, useCoTransmissionQuery } from '../../hooks/queries/lab';
import { LoadFailed, Loading } from '../layout/query-states';
import { Checkbox } from '../ui/checkbox';
import { FieldError } from '../ui/field-error';
import { Text } from '../ui/text';
import { EditRows, type EditColumn } from './edit-rows';
import { TableSaveBar, useTableSave } from './table-save';

interface Values {
  groups: CoTransmissionGroup[];
}

export function CoTransmissionEditor({ filing }: { filing: FilingDetail }) {
  const q = useCoTransmissionQuery(filing.id);
  if (q.isPending) return <Loading label="Loading the co-transmission groups…" />;
  if (q.isError) return <LoadFailed what="the co-transmission groups" error={q.error} onRetry={() => void q.refetch()} />;
  return <GroupsForm filing={filing} groups={q.data.groups} revision={q.data.revision} />;
}

const toValues = (groups: CoTransmissionGroup[]): Values => ({ groups });
const fromValues = (v: Values) => v.groups;

function GroupsForm({ filing, groups, revision }: { filing: FilingDetail; groups: CoTransmissionGroup[]; revision: string }) {
  const editable = filing.editable;
  const queryClient = useQueryClient();
  const form = useForm<Values>({
    resolver: zodResolver(zCoTransmissionBody) as unknown as Resolver<Values>,
    defaultValues: toValues(groups),
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { control } = form;
  const list = useFieldArray({ control, name: 'groups', keyName: 'key' });
  const values = useWatch({ control, name: 'groups' }) ?? [];
  const send = useCallback((rows: CoTransmissionGroup[], rev: string | undefined) => saveCoTransmission(filing.id, rows, rev), [filing.id]);
  const onSaved = useCallback(
    (saved: { rows: CoTransmissionGroup[]; revision: string }) => {
      queryClient.setQueryData(coTransmissionKey(filing.id), (old: { version: number } | undefined) => ({ version: old?.version ?? 0, groups: saved.rows, revision: saved.revision }));
      void queryClient.invalidateQueries({ queryKey: labKeys.results(filing.id) });
      void queryClient.invalidateQueries({ queryKey: filingKeys.detail(filing.id) });
    },
    [queryClient, filing.id],
  );
  const saving = useTableSave<Values, CoTransmissionGroup[]>({ form, rows: groups, revision, send, stale: staleCoTransmission, toValues, fromValues, onSaved });

  const transmitters = filing.data.radios.transmitters.map((t) => t.id);
  const positions = filing.data['use-positions'].usePositions;
  const sections: { id: string | null; title: string; hint: string }[] = [
    { id: null, title: 'In every use position', hint: 'Groups here are summed in each use position.' },
    ...positions.map((p) => ({ id: p.id, title: `${p.id} · ${USE_POSITION_LABELS[p.kind]}`, hint: `Only in ${p.id}, besides the groups of every position.` })),
  ];
  const nameOf = (i: number) => (values[i]?.transmitterIds?.length ? values[i].transmitterIds.join(' + ') : 'new group');

  const column = (section: string): EditColumn => ({
    key: 'tx',
    label: 'Transmitters on together',
    flex: 1,
    render: (i) => (
      <Controller
        control={control}
        name={`groups.${i}.transmitterIds`}
        render={({ field, fieldState }) => {
          const on = (field.value ?? []) as string[];
          const error = fieldState.error?.message ?? form.formState.errors.groups?.[i]?.usePositionId?.message;
          return (
            <View style={styles.cell}>
              <View style={styles.chips} role="group" accessibilityLabel={`Transmitters of group ${nameOf(i)} (${section})`}>
                {transmitters.map((t) => (
                  <Checkbox
                    key={t}
                    label={t}
                    checked={on.includes(t)}
                    disabled={!editable}
                    // Kept in the order of the Radios step.
                    onChange={(checked) => field.onChange(transmitters.filter((x) => (x === t ? checked : on.includes(x))))}
                    testID={`cotx-group-${i}-${t}`}
                  />
                ))}
              </View>
              {error ? <FieldError message={error} testID={`cotx-group-${i}-error`} /> : null}
            </View>
          );
        }}
      />
    ),
  });

  return (
    <View style={styles.wrap} testID="cotx-editor">
      {transmitters.length < 2 ? (
        <Text tone="muted">Co-transmission needs at least two transmitters under Radios.</Text>
      ) : (
        sections.map((s) => {
          const indices = values.map((g, i) => (g?.usePositionId === s.id ? i : -1)).filter((i) => i >= 0);
          const key = s.id ?? 'every';
          return (
            <View key={key} style={styles.section} testID={`cotx-section-${key}`}>
              <Text variant="label" tone="copper">
                {s.title}
              </Text>
              <Text variant="small" tone="muted">
                {s.hint}
              </Text>
              <EditRows
                noun="group"
                columns={[column(s.title)]}
                count={list.fields.length}
                indices={indices}
                keyOf={(i) => list.fields[i].key}
                titleOf={nameOf}
                onAdd={() => list.append({ usePositionId: s.id, transmitterIds: [] })}
                addLabel={s.id ? `Add a group for ${s.id}` : 'Add a group for every position'}
                onRemove={(i) => list.remove(i)}
                removalEffects={(i) => [`the co-transmission sums of ${nameOf(i)} ${s.id ? `in ${s.id}` : 'in every use position'}`]}
                editable={editable}
                testID={`cotx-${key}`}
                empty={s.id ? 'No groups of this position only.' : 'No groups for every position.'}
              />
            </View>
          );
        })
      )}
      {editable ? (
        <TableSaveBar status={saving.status} dirty={form.formState.isDirty} onSave={() => void saving.save()} onResolve={saving.resolveConflict} noun="groups" testID="cotx" />
      ) : (
        <Text variant="small" tone="muted">
          The compliance specialist edits these groups.
        </Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  section: { gap: space.xs, borderTopWidth: 1, borderTopColor: palette.paperDeep, paddingTop: space.sm },
  cell: { gap: space.xxs },
  chips: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
});
