/**
 * Activity (admin): the organisation's audit trail, newest first, with pickers for filing, person
 * and kind. The filters live in the address (?filing=&person=&kind=), so a filtered view can be
 * reloaded or shared.
 */
import { useLocalSearchParams, useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { AUDIT_KIND_LABELS, AUDIT_KINDS, AUDIT_LIST_LIMIT, type AuditKind } from '../../constants/schemas/audit';
import { palette, space } from '../../constants/theme';
import { useAuditQuery, type AuditFilters } from '../../hooks/queries/audit';
import { useFilingsQuery } from '../../hooks/queries/filings';
import { useCurrentUser } from '../../hooks/queries/session';
import { useUsersQuery } from '../../hooks/queries/users';
import { useIsWide } from '../../hooks/use-is-wide';
import { formatDateTime } from '../format';
import { LoadFailed, Loading } from '../layout/query-states';
import { RequireRole } from '../layout/require-role';
import { Screen } from '../layout/screen';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { SelectField } from '../ui/select-field';
import { Text } from '../ui/text';
import { actionLabel, describeEntry } from '../users/activity-words';

export function ActivityScreen() {
  return (
    <RequireRole role="admin" title="Activity">
      <ActivityList />
    </RequireRole>
  );
}

const ALL = '';
const idParam = (v: unknown) => (typeof v === 'string' && /^[1-9][0-9]{0,14}$/.test(v) ? Number(v) : undefined);

/** The filters in the address; a value that is not one (a typo in a link) is no filter. */
function useFilters(): [AuditFilters, (next: AuditFilters) => void] {
  const router = useRouter();
  const params = useLocalSearchParams<{ filing?: string; person?: string; kind?: string }>();
  const filters: AuditFilters = {
    filing: idParam(params.filing),
    person: idParam(params.person),
    kind: (AUDIT_KINDS as readonly string[]).includes(params.kind ?? '') ? (params.kind as AuditKind) : undefined,
  };
  const set = (next: AuditFilters) => router.setParams({ filing: next.filing ? String(next.filing) : undefined, person: next.person ? String(next.person) : undefined, kind: next.kind ?? undefined });
  return [filters, set];
}

function ActivityList() {
  const me = useCurrentUser();
  const wide = useIsWide();
  const [filters, setFilters] = useFilters();
  const entries = useAuditQuery(filters);
  const filings = useFilingsQuery('', 'name');
  const people = useUsersQuery();
  const filingName = new Map((filings.data ?? []).map((f) => [f.id, f.device.name]));
  const filtered = !!(filters.filing || filters.person || filters.kind);

  const filingOptions = [{ value: ALL, label: 'All filings' }, ...(filings.data ?? []).map((f) => ({ value: String(f.id), label: `${f.device.name} (${f.device.model})` }))];
  const personOptions = [{ value: ALL, label: 'Everyone' }, ...(people.data ?? []).map((p) => ({ value: String(p.id), label: p.active ? p.name : `${p.name} (deactivated)` }))];
  const kindOptions = [{ value: ALL, label: 'Every kind' }, ...AUDIT_KINDS.map((k) => ({ value: k, label: AUDIT_KIND_LABELS[k] }))];

  return (
    <Screen
      eyebrow={me.organisation.name}
      title="Activity"
      subtitle="Everything recorded in your organisation — sign-ins, people, filing data, evidence, reviews and signatures — newest first. Entries cannot be edited or removed."
      testID="activity-screen"
    >
      <Card>
        <View style={[styles.filters, wide && styles.filtersWide]} testID="activity-filters">
          <View style={wide ? styles.filterWide : undefined}>
            <SelectField
              label="Filing"
              options={filingOptions}
              value={filters.filing ? String(filters.filing) : ALL}
              onChange={(v) => setFilters({ ...filters, filing: idParam(v) })}
              testID="activity-filter-filing"
            />
          </View>
          <View style={wide ? styles.filterWide : undefined}>
            <SelectField
              label="Person"
              options={personOptions}
              value={filters.person ? String(filters.person) : ALL}
              onChange={(v) => setFilters({ ...filters, person: idParam(v) })}
              testID="activity-filter-person"
            />
          </View>
          <View style={wide ? styles.filterWide : undefined}>
            <SelectField
              label="Kind"
              options={kindOptions}
              value={filters.kind ?? ALL}
              onChange={(v) => setFilters({ ...filters, kind: (AUDIT_KINDS as readonly string[]).includes(v) ? (v as AuditKind) : undefined })}
              testID="activity-filter-kind"
            />
          </View>
          {filtered ? <Button label="Clear filters" variant="quiet" compact icon="cross" onPress={() => setFilters({})} testID="activity-filter-clear" /> : null}
        </View>
      </Card>
      <Card>
        {entries.isPending ? (
          <Loading label="Loading activity…" />
        ) : entries.isError ? (
          <LoadFailed what="the activity" error={entries.error} onRetry={() => void entries.refetch()} />
        ) : entries.data.entries.length === 0 ? (
          <Text tone="soft" testID="activity-empty">
            {filtered ? 'Nothing recorded matches these filters.' : 'Nothing recorded yet.'}
          </Text>
        ) : (
          <View style={{ marginVertical: -space.sm }}>
            {entries.data.entries.map((e, i) => (
              <View key={e.id} style={[styles.entry, wide && styles.entryWide, i > 0 && styles.divider]} testID="activity-entry">
                <Text variant="small" tone="muted" style={wide ? styles.when : undefined}>
                  {formatDateTime(e.at)}
                </Text>
                <View style={{ flex: 1, gap: 1 }}>
                  <Text variant="bodyStrong" tone={e.action.endsWith('failed') || e.action.endsWith('refused') ? 'fail' : 'ink'}>
                    {actionLabel(e.action, e.details)}
                    <Text tone="soft">{` — ${e.actorName ?? 'unknown user'}`}</Text>
                  </Text>
                  <Text variant="small" tone="soft" testID="activity-entry-about">
                    {[e.kind ? AUDIT_KIND_LABELS[e.kind] : null, e.filingId ? (filingName.get(e.filingId) ?? `filing #${e.filingId}`) : null, describeEntry(e) || null].filter(Boolean).join(' · ')}
                  </Text>
                </View>
              </View>
            ))}
            {entries.data.more ? (
              <Text variant="small" tone="muted" style={styles.more} testID="activity-more">
                {`Showing the newest ${AUDIT_LIST_LIMIT}. Narrow the filters to see older entries.`}
              </Text>
            ) : null}
          </View>
        )}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.md },
  filtersWide: { flexDirection: 'row', alignItems: 'flex-end', flexWrap: 'wrap' },
  filterWide: { flex: 1, minWidth: 200 },
  more: { paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: palette.line },
  entry: { paddingVertical: space.sm, gap: 2 },
  entryWide: { flexDirection: 'row', gap: space.lg, alignItems: 'baseline' },
  divider: { borderTopWidth: 1, borderTopColor: palette.line },
  when: { width: 160 },
});
