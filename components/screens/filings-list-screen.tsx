/** /filings: the organisation's filings with state, markets, last change and owner; search and sort. */
import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { useEffect, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { PRODUCT_TYPE_LABELS } from '../../constants/schemas/device-file';
import type { FilingSummary } from '../../constants/schemas/filings';
import { layout, palette, radii, space } from '../../constants/theme';
import { FILING_SORTS } from '../../constants/schemas/filings';
import { useFilingsQuery, type FilingSort } from '../../hooks/queries/filings';
import { hasRole, useCurrentUser } from '../../hooks/queries/session';
import { useIsWide } from '../../hooks/use-is-wide';
import { STATE_LOOK, regimeShort } from '../filings/labels';
import { formatDateTime } from '../format';
import { Icon } from '../icons';
import { LoadFailed, Loading } from '../layout/query-states';
import { Screen } from '../layout/screen';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Checkbox } from '../ui/checkbox';
import { ChoiceChips } from '../ui/choice-chips';
import { InputBox } from '../ui/input-box';
import { Chip, StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';

const SORT_CHOICES = [
  { value: 'updated', label: 'Last change' },
  { value: 'name', label: 'Device name' },
  { value: 'state', label: 'State' },
] as const;

export function FilingsListScreen() {
  const user = useCurrentUser();
  const router = useRouter();
  const canCreate = hasRole(user, 'specialist');
  const params = useLocalSearchParams<{ q?: string; sort?: string; archived?: string }>();
  const showArchived = params.archived === '1';
  const q = typeof params.q === 'string' ? params.q : '';
  const sort: FilingSort = (FILING_SORTS as readonly string[]).includes(params.sort ?? '') ? (params.sort as FilingSort) : 'updated';
  const [search, setSearch] = useState(q);
  const setSort = (next: FilingSort) => router.setParams({ sort: next === 'updated' ? undefined : next });
  useEffect(() => {
    const t = setTimeout(() => {
      if (search !== q) router.setParams({ q: search.trim() ? search : undefined });
    }, 250);
    return () => clearTimeout(t);
  }, [search, q, router]);
  const filings = useFilingsQuery(q, sort, showArchived);

  return (
    <Screen
      eyebrow={user.organisation.name}
      title="Filings"
      subtitle="One filing per device: its radios, use positions and markets, screened step by step."
      testID="filings-screen"
      actions={
        canCreate ? (
          <>
            <Button label="Import device file" variant="secondary" icon="link" onPress={() => router.push('/filings/new?import=1')} testID="filings-import" />
            <Button label="New filing" icon="plus" onPress={() => router.push('/filings/new')} testID="filings-new" />
          </>
        ) : null
      }
    >
      <View style={styles.tools}>
        <View style={styles.search}>
          <InputBox label="Search device, model or applicant" value={search} onChangeText={setSearch} placeholder="e.g. TH4" testID="filings-search" autoCorrect={false} />
        </View>
        <ChoiceChips label="Sort by" choices={SORT_CHOICES} value={sort} onChange={setSort} testID="filings-sort" />
        <Checkbox label="Show archived filings" checked={showArchived} onChange={(next) => router.setParams({ archived: next ? '1' : undefined })} testID="filings-show-archived" />
      </View>
      {filings.isPending ? (
        <Loading label="Loading filings…" />
      ) : filings.isError ? (
        <LoadFailed what="filings" error={filings.error} onRetry={() => void filings.refetch()} />
      ) : filings.data.length === 0 ? (
        <Card testID="filings-empty">
          <Text variant="heading">{q ? `No filing matches “${q}”` : 'No filings yet'}</Text>
          <Text tone="soft">
            {q
              ? 'Try part of the device name, the model number or the applicant.'
              : canCreate
                ? 'Start one from the device’s name and model, or import a device description file from your lab’s tools.'
                : 'A compliance specialist in your organisation starts filings; they will appear here.'}
          </Text>
        </Card>
      ) : (
        <View role="list" style={styles.list} testID="filings-list">
          {filings.data.map((f) => (
            <FilingRow key={f.id} filing={f} />
          ))}
        </View>
      )}
    </Screen>
  );
}

function FilingRow({ filing }: { filing: FilingSummary }) {
  const wide = useIsWide();
  const state = STATE_LOOK[filing.version.state];
  return (
    <Link href={`/filings/${filing.id}`} asChild>
      <Pressable
        role="listitem"
        accessibilityLabel={`${filing.device.name}, ${filing.device.model}, ${state.label}${filing.archivedAt ? ', archived' : ''}`}
        testID={`filing-row-${filing.id}`}
        style={StyleSheet.flatten([styles.row, wide && styles.rowWide])}
      >
        <View style={styles.identity}>
          <Text variant="bodyStrong">{filing.device.name}</Text>
          <Text variant="small" tone="soft">
            {filing.device.model} · {filing.device.applicant} · {PRODUCT_TYPE_LABELS[filing.device.productType as keyof typeof PRODUCT_TYPE_LABELS] ?? filing.device.productType}
          </Text>
        </View>
        <View style={[styles.meta, wide && styles.metaWide]}>
          <StatusBadge tone={state.tone} icon={state.icon} label={`v${filing.version.number} · ${state.label}`} />
          {filing.archivedAt ? <StatusBadge tone="caution" icon="info" label="Archived" testID={`filing-archived-${filing.id}`} /> : null}
          <View style={styles.markets}>
            {filing.markets.length ? (
              filing.markets.map((m) => <Chip key={m} label={regimeShort(m)} />)
            ) : (
              <Text variant="small" tone="muted">
                No markets yet
              </Text>
            )}
          </View>
          <Text variant="small" tone="muted" style={wide ? styles.when : undefined}>
            {formatDateTime(filing.updatedAt)} · {filing.owner.name}
          </Text>
        </View>
        <Icon name="chevronRight" size={18} color={palette.inkMuted} />
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  tools: { gap: space.md },
  search: { maxWidth: 420 },
  list: { backgroundColor: palette.surface, borderRadius: radii.lg, borderWidth: 1, borderColor: palette.line, overflow: 'hidden' },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md, minHeight: layout.touchMinPx, padding: space.lg, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  rowWide: { flexWrap: 'nowrap' },
  identity: { flex: 1, minWidth: 200, gap: 2 },
  meta: { gap: space.xs, flexBasis: '100%', order: 3 } as object,
  metaWide: { flexBasis: 'auto', order: 0, flexDirection: 'row', alignItems: 'center', gap: space.md, flexShrink: 0 } as object,
  markets: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  when: { width: 220, textAlign: 'right' },
});
