/**
 * Rows of a step (antennas, transmitters, use positions): an editable table on a wide screen,
 * a card per row on a phone. Adding a row is one tap; removing one asks first and says what
 * goes with it.
 */
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { layout, palette, radii, space } from '../../constants/theme';
import { useIsWide } from '../../hooks/use-is-wide';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { FieldError } from '../ui/field-error';
import { Sheet } from '../ui/sheet';
import { Text } from '../ui/text';

export interface EditColumn {
  key: string;
  /** Column heading (wide) and field label (phone), with its unit. */
  label: string;
  flex: number;
  /** On a phone, numbers sit two to a line. */
  half?: boolean;
  render: (index: number, hideLabel: boolean) => React.ReactNode;
}

export function EditRows({
  noun,
  columns,
  count,
  keyOf,
  titleOf,
  onAdd,
  onRemove,
  editable,
  testID,
  empty,
  removalEffects,
  details,
  rowNotes,
  indices,
  addLabel,
}: {
  noun: string;
  columns: EditColumn[];
  count: number;
  keyOf: (i: number) => string;
  titleOf: (i: number) => string;
  onAdd: () => void;
  onRemove: (i: number) => void;
  editable: boolean;
  testID: string;
  empty: string;
  /** What else is removed or left without a partner when row i goes, in words. */
  removalEffects?: (i: number) => string[];
  /** More fields of a row, behind a "more" toggle under it; `summary` says what they hold. */
  details?: { label: string; render: (i: number) => React.ReactNode; summary?: (i: number) => string };
  /** Wide table: notes on row i in full under it (its cells, too narrow for them, are marked short). */
  rowNotes?: (i: number) => string[];
  /** The rows to show (a page of a long table, or one section's rows); all rows when left out. */
  indices?: readonly number[];
  /** The add button's words, when "Add <noun>" is not enough. */
  addLabel?: string;
}) {
  const wide = useIsWide();
  const [asking, setAsking] = useState<number | null>(null);
  const [open, setOpen] = useState<ReadonlySet<string>>(new Set());
  const toggle = (key: string) =>
    setOpen((o) => {
      const next = new Set(o);
      if (next.has(key)) next.delete(key);
      else next.add(key);
      return next;
    });
  const more = (i: number) => {
    if (!details) return null;
    const key = keyOf(i);
    const isOpen = open.has(key);
    const summary = details.summary?.(i);
    return (
      <View style={wide ? styles.detailsWide : styles.details}>
        <Pressable
          accessibilityRole="button"
          accessibilityState={{ expanded: isOpen }}
          accessibilityLabel={`${isOpen ? 'Hide' : 'Show'} ${details.label} of ${noun} ${titleOf(i) || i + 1}`}
          onPress={() => toggle(key)}
          testID={`${testID}-more-${i}`}
          style={({ pressed }) => [styles.moreToggle, pressed && { opacity: 0.6 }]}
        >
          <Icon name={isOpen ? 'chevronDown' : 'chevronRight'} size={16} color={palette.accent} />
          <Text variant="smallStrong" tone="accent">
            {details.label}
          </Text>
          {summary && !isOpen ? (
            <Text variant="small" tone="muted" numberOfLines={1} style={{ flexShrink: 1 }}>
              {summary}
            </Text>
          ) : null}
        </Pressable>
        {isOpen ? <View testID={`${testID}-details-${i}`}>{details.render(i)}</View> : null}
      </View>
    );
  };
  const rows = indices ?? Array.from({ length: count }, (_, i) => i);
  const remove = (i: number) =>
    editable ? (
      <Pressable
        accessibilityRole="button"
        accessibilityLabel={`Remove ${noun} ${titleOf(i)}`}
        onPress={() => setAsking(i)}
        testID={`${testID}-remove-${i}`}
        style={({ pressed }) => [styles.remove, pressed && { backgroundColor: palette.failSoft }]}
      >
        <Icon name="cross" size={18} color={palette.fail} />
      </Pressable>
    ) : null;
  return (
    <View style={styles.wrap} testID={testID}>
      {rows.length === 0 ? (
        <Text tone="muted" style={styles.empty}>
          {empty}
        </Text>
      ) : wide ? (
        <View style={styles.table} role="table">
          <View style={[styles.tr, styles.th]} role="row">
            {/* A View per heading, like the cells below it: a Text with flex sizes from its content and drifts off its column. */}
            {columns.map((c) => (
              <View key={c.key} role="columnheader" style={[styles.cell, { flex: c.flex }]}>
                <Text variant="smallStrong" tone="soft">
                  {c.label}
                </Text>
              </View>
            ))}
            {/* The remove buttons' column has no heading text (each button names its row), so it is a plain cell, not an empty header. */}
            {editable ? <View style={styles.removeCol} role="cell" /> : null}
          </View>
          {rows.map((i) => (
            <View key={keyOf(i)} style={details ? styles.rowGroup : undefined} role="rowgroup">
              <View style={[styles.tr, details && styles.trGrouped]} role="row" testID={`${testID}-row-${i}`}>
                {columns.map((c) => (
                  <View key={c.key} style={[styles.cell, { flex: c.flex }]} role="cell">
                    {c.render(i, true)}
                  </View>
                ))}
                {editable ? (
                  <View style={styles.removeCol} role="cell">
                    {remove(i)}
                  </View>
                ) : null}
              </View>
              <MoreRow>
                {rowNotes?.(i).length ? (
                  <View style={styles.rowNotes} testID={`${testID}-notes-${i}`}>
                    {rowNotes(i).map((n) => (
                      <FieldError key={n} message={n} />
                    ))}
                  </View>
                ) : null}
              </MoreRow>
              <MoreRow>{more(i)}</MoreRow>
            </View>
          ))}
        </View>
      ) : (
        rows.map((i) => (
          <View key={keyOf(i)} style={styles.card} testID={`${testID}-row-${i}`}>
            <View style={styles.cardHead}>
              <Text variant="label" tone="accent" style={{ flex: 1 }}>
                {`${noun} ${i + 1}${titleOf(i) ? ` · ${titleOf(i)}` : ''}`}
              </Text>
              {remove(i)}
            </View>
            <View style={styles.cardGrid}>
              {columns.map((c) => (
                <View key={c.key} style={c.half ? styles.half : styles.full}>
                  {c.render(i, false)}
                </View>
              ))}
            </View>
            {more(i)}
          </View>
        ))
      )}
      {editable ? <Button label={addLabel ?? `Add ${noun}`} icon="plus" variant="secondary" onPress={onAdd} testID={`${testID}-add`} style={styles.add} /> : null}
      {asking !== null && asking < count ? (
        <ConfirmRemoval
          title={`Remove ${noun} ${titleOf(asking) || asking + 1}?`}
          effects={removalEffects?.(asking) ?? []}
          onCancel={() => setAsking(null)}
          onConfirm={() => {
            onRemove(asking);
            setAsking(null);
          }}
          testID={`${testID}-confirm-remove`}
        />
      ) : null}
    </View>
  );
}

function ConfirmRemoval({ title, effects, onCancel, onConfirm, testID }: { title: string; effects: string[]; onCancel: () => void; onConfirm: () => void; testID: string }) {
  return (
    <Sheet visible title={title} onClose={onCancel} testID={testID}>
      <View style={styles.effects} testID={`${testID}-effects`}>
        {effects.length ? (
          <>
            <Text>Goes with it when the step saves:</Text>
            {effects.map((e) => (
              <Text key={e} variant="small">{`• ${e}`}</Text>
            ))}
          </>
        ) : (
          <Text>Nothing else refers to it.</Text>
        )}
      </View>
      <View style={styles.confirmButtons}>
        <Button label="Remove" icon="cross" variant="danger" onPress={onConfirm} testID={`${testID}-yes`} />
        <Button label="Keep it" variant="secondary" onPress={onCancel} testID={`${testID}-no`} />
      </View>
    </Sheet>
  );
}

export { nextId } from './next-id';

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  empty: { paddingVertical: space.sm },
  table: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.md, backgroundColor: palette.surface, overflow: 'hidden' },
  tr: { flexDirection: 'row', alignItems: 'flex-start', gap: space.xs, paddingHorizontal: space.sm, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  th: { backgroundColor: palette.paper, alignItems: 'flex-end', paddingVertical: space.sm },
  cell: { minWidth: 0 },
  removeCol: { width: layout.touchMinPx, alignItems: 'center' },
  remove: { width: layout.touchMinPx, height: layout.touchMinPx, alignItems: 'center', justifyContent: 'center', borderRadius: radii.md },
  card: { backgroundColor: palette.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: palette.line, padding: space.md, gap: space.sm },
  cardHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: layout.touchMinPx, marginVertical: -space.xs },
  cardGrid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  full: { flexBasis: '100%' },
  half: { flexBasis: '45%', flexGrow: 1 },
  add: { alignSelf: 'flex-start' },
  effects: { gap: space.xs },
  rowNotes: { gap: space.xxs, paddingHorizontal: space.sm, paddingBottom: space.xs },
  rowGroup: { borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  trGrouped: { borderBottomWidth: 0 },
  details: { gap: space.sm },
  detailsWide: { gap: space.sm, paddingHorizontal: space.sm, paddingBottom: space.sm },
  moreToggle: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: layout.touchMinPx, alignSelf: 'flex-start', maxWidth: '100%' },
  confirmButtons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

/** A table row's details (below the row) as a row of one cell, so the table holds only rows (ARIA). */
function MoreRow({ children }: { children: React.ReactNode }) {
  if (!children) return null;
  return (
    <View role="row">
      <View role="cell">{children}</View>
    </View>
  );
}
