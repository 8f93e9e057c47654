/**
 * The trade's usual test positions for a kind of product, as a starting point: pick the set
 * (the device's product type picks it first; a module picks its host's), see what each position
 * is, its averaging mass, test separation and source, and add those not yet in the list.
 */
import { sourceWords } from '../source-words';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import {
  MODULE_POSITIONS_NOTE,
  POSITION_SET_OF_PRODUCT,
  STANDARD_POSITION_SET_KEYS,
  STANDARD_POSITION_SETS,
  standardPositionsToAdd,
  type StandardPosition,
  type StandardPositionSetKey,
} from '../../constants/standard-positions';
import { USE_POSITION_LABELS, type ProductType } from '../../constants/schemas/device-file';
import { space } from '../../constants/theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { SelectField } from '../ui/select-field';
import { Text } from '../ui/text';

const SET_OPTIONS = STANDARD_POSITION_SET_KEYS.map((k) => ({ value: k, label: STANDARD_POSITION_SETS[k].label }));

const mm = (m: number) => `${Number((m * 1000).toFixed(1))} mm`;

export function StandardPositionsCard({ productType, existingIds, onAdd }: { productType: ProductType; existingIds: readonly (string | undefined)[]; onAdd: (positions: StandardPosition[]) => void }) {
  const [set, setSet] = useState<StandardPositionSetKey | ''>(POSITION_SET_OF_PRODUCT[productType] ?? '');
  const toAdd = set ? standardPositionsToAdd(set, existingIds) : [];
  return (
    <Card title="Standard test positions">
      <View style={styles.body} testID="standard-positions">
        <Text variant="small" tone="muted">
          The usual SAR test positions for a kind of product, to start from: each is added with its exposure condition and every antenna a transmitter uses at the position’s test separation
          (conservative: the antenna sits at least that far in) — edit or remove any of them.
        </Text>
        {productType === 'iot-module' ? (
          <Text variant="small" testID="standard-positions-module">
            {MODULE_POSITIONS_NOTE}
          </Text>
        ) : null}
        <SelectField label="Positions of a" options={SET_OPTIONS} value={set} placeholder="Pick a kind of product" onChange={(v) => setSet(v as StandardPositionSetKey)} testID="standard-set" />
        {set ? (
          <>
            <Text variant="small" tone="soft">
              {STANDARD_POSITION_SETS[set].note}
            </Text>
            {toAdd.length ? (
              <View style={styles.list} testID="standard-positions-list">
                {toAdd.map((p) => (
                  <Text key={p.id} variant="small" testID={`standard-${p.id}`}>
                    {`${p.id} — ${p.surface}: ${USE_POSITION_LABELS[p.kind].toLowerCase()}, ${p.averagingMassG} g, ${mm(p.separationM)}. Source: ${sourceWords(p.source)}.`}
                  </Text>
                ))}
              </View>
            ) : (
              <Text variant="small" tone="soft" testID="standard-positions-all-there">
                Every position of this set is already in the list.
              </Text>
            )}
            {toAdd.length ? (
              <Button
                label={`Add ${toAdd.length} standard position${toAdd.length === 1 ? '' : 's'}`}
                variant="secondary"
                icon="plus"
                style={styles.add}
                onPress={() => onAdd(toAdd)}
                testID="standard-positions-add"
              />
            ) : null}
          </>
        ) : null}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  body: { gap: space.sm },
  list: { gap: space.xxs },
  add: { alignSelf: 'flex-start' },
});
