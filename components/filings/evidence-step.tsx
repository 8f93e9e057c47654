/**
 * Step 6, Evidence: which categories this filing needs (present or missing, each with why),
 * uploading several files at once with progress per file, the filed records, and what the
 * read-back of the test reports found against the filing's own numbers.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { CATEGORY_BY_ID, UPLOADABLE_CATEGORIES, type EvidenceList, type EvidenceRecord, type ReadBackFinding } from '../../constants/schemas/evidence';
import type { FilingDetail } from '../../constants/schemas/filings';
import { palette, radii, space } from '../../constants/theme';
import { asProblem } from '../../hooks/api-client';
import { evidenceFileUrl, uploadEvidence, useEvidenceQuery, useExplainFindingMutation, useRefreshEvidence, useRemoveEvidenceMutation } from '../../hooks/queries/evidence';
import { useIsWide } from '../../hooks/use-is-wide';
import { formatDateTime } from '../format';
import { Icon } from '../icons';
import { CautionNote } from '../layout/caution-note';
import { LoadFailed, Loading } from '../layout/query-states';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { InputBox } from '../ui/input-box';
import { Notice } from '../ui/notice';
import { SelectField } from '../ui/select-field';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { EvidencePicker, type PickedFile } from './evidence-picker';

export const formatBytes = (n: number) => (n < 1024 ? `${n} B` : n < 1024 * 1024 ? `${(n / 1024).toFixed(1)} KB` : `${(n / 1024 / 1024).toFixed(1)} MB`);

export function EvidenceStep({ filing }: { filing: FilingDetail }) {
  const query = useEvidenceQuery(filing.id);
  if (query.isPending) return <Loading label="Loading the evidence…" />;
  if (query.isError) return <LoadFailed what="the evidence" error={query.error} onRetry={() => void query.refetch()} />;
  const list = query.data;
  return (
    <View style={styles.stack}>
      <RequiredCard list={list} />
      {list.editable ? (
        <UploadCard filingId={filing.id} list={list} />
      ) : (
        <Notice tone="info">{`You can read and download this version’s evidence; uploading needs the engineer or specialist role on a version that is not signed.`}</Notice>
      )}
      <FindingsCard filingId={filing.id} list={list} />
      <RecordsCard filingId={filing.id} list={list} />
      <CautionNote />
    </View>
  );
}

function RequiredCard({ list }: { list: EvidenceList }) {
  const missing = list.required.filter((r) => !r.present).length;
  return (
    <Card
      title="What this filing needs"
      aside={<StatusBadge tone={missing ? 'caution' : 'pass'} icon={missing ? 'warning' : 'check'} label={missing ? `${missing} missing` : 'All present'} testID="evidence-required-summary" />}
      testID="evidence-required"
    >
      <View role="list" style={styles.rows}>
        {list.required.map((r) => (
          <View key={r.category} role="listitem" style={styles.requiredRow} testID={`required-${r.category}`}>
            <View style={styles.state}>
              <Icon name={r.present ? 'check' : 'warning'} size={16} color={r.present ? palette.pass : palette.caution} strokeWidth={2} />
              <Text variant="smallStrong" style={{ color: r.present ? palette.pass : palette.caution }} testID={`required-state-${r.category}`}>
                {r.writtenByFieldfile ? 'Written by Fieldfile' : r.present ? 'Present' : 'Missing'}
              </Text>
            </View>
            <View style={{ flex: 1, minWidth: 200 }}>
              <Text variant="bodyStrong">{CATEGORY_BY_ID[r.category].label}</Text>
              <Text variant="small" tone="soft">
                {r.reason}
              </Text>
            </View>
          </View>
        ))}
      </View>
    </Card>
  );
}

interface Upload {
  id: number;
  fileName: string;
  sizeBytes: number;
  progress: number;
  state: 'sending' | 'filed' | 'refused';
  message?: string;
}

let uploadSeq = 0;

function UploadCard({ filingId, list }: { filingId: number; list: EvidenceList }) {
  const wide = useIsWide();
  const refresh = useRefreshEvidence(filingId);
  const [category, setCategory] = useState<string>('');
  const [title, setTitle] = useState('');
  const [note, setNote] = useState('');
  const [documentDate, setDocumentDate] = useState('');
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [categoryError, setCategoryError] = useState<string | undefined>();
  const chosen = UPLOADABLE_CATEGORIES.find((c) => c.id === category);
  const missingFirst = [...UPLOADABLE_CATEGORIES].sort(
    (a, b) => Number(list.required.some((r) => r.category === b.id && !r.present)) - Number(list.required.some((r) => r.category === a.id && !r.present)),
  );
  const patch = (id: number, p: Partial<Upload>) => setUploads((all) => all.map((u) => (u.id === id ? { ...u, ...p } : u)));

  const send = async (files: PickedFile[]) => {
    if (!chosen) {
      setCategoryError('Pick the category these files belong to first.');
      return;
    }
    setCategoryError(undefined);
    const started = files.map((f) => ({ id: ++uploadSeq, fileName: f.fileName, sizeBytes: f.sizeBytes, progress: 0, state: 'sending' as const }));
    setUploads((all) => [...started, ...all]);
    await Promise.all(
      files.map(async (f, i) => {
        const id = started[i].id;
        try {
          const res = await uploadEvidence(
            filingId,
            {
              file: f.file,
              fileName: f.fileName,
              category: chosen.id,
              title: files.length === 1 ? title.trim() || undefined : undefined,
              note: note.trim() || undefined,
              documentDate: documentDate.trim() || undefined,
            },
            (progress) => patch(id, { progress }),
          );
          patch(id, { state: 'filed', progress: 1, message: res.notice });
        } catch (err) {
          patch(id, { state: 'refused', message: asProblem(err).message });
        }
      }),
    );
    setTitle('');
    setNote('');
    await refresh();
  };

  return (
    <Card title="File evidence" testID="evidence-upload">
      <View style={[styles.form, wide && styles.formWide]}>
        <View style={styles.formField}>
          <SelectField
            label="Category"
            options={missingFirst.map((c) => ({ value: c.id, label: c.label }))}
            value={category || undefined}
            onChange={(v) => {
              setCategory(v);
              setCategoryError(undefined);
            }}
            error={categoryError}
            testID="evidence-category"
          />
        </View>
        <View style={styles.formField}>
          <InputBox label="Title (optional)" value={title} onChangeText={setTitle} hint="For one file; several files keep their own names." testID="evidence-title" />
        </View>
        {chosen?.dateLabel ? (
          <View style={styles.formField}>
            <InputBox label={`${chosen.dateLabel} (optional)`} value={documentDate} onChangeText={setDocumentDate} placeholder="YYYY-MM-DD" testID="evidence-date" />
          </View>
        ) : null}
        <View style={styles.formField}>
          <InputBox label="Note (optional)" value={note} onChangeText={setNote} testID="evidence-note" />
        </View>
      </View>
      {chosen ? (
        <Text variant="small" tone="soft" testID="evidence-accepts">
          {`${chosen.description} Takes ${chosen.accepts.map((m) => MEDIA_SHORT[m] ?? m).join(', ')}; up to ${formatBytes(list.limits.maxFileBytes)} a file.`}
        </Text>
      ) : null}
      <EvidencePicker onFiles={(f) => void send(f)} wide={wide} accept={chosen ? chosen.accepts.join(',') : ''} />
      {uploads.length ? (
        <View role="list" accessibilityLabel="Uploads" style={styles.rows} testID="evidence-uploads">
          {uploads.map((u) => (
            <UploadRow key={u.id} u={u} />
          ))}
        </View>
      ) : null}
    </Card>
  );
}

const MEDIA_SHORT: Record<string, string> = {
  'application/pdf': 'PDF',
  'image/png': 'PNG',
  'image/jpeg': 'JPEG',
  'image/heic': 'HEIC',
  'image/tiff': 'TIFF',
  'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet': 'XLSX',
  'application/vnd.openxmlformats-officedocument.wordprocessingml.document': 'DOCX',
  'text/csv': 'CSV',
  'text/plain': 'text',
};

function UploadRow({ u }: { u: Upload }) {
  const look =
    u.state === 'filed'
      ? { icon: 'check' as const, color: palette.pass, word: 'Filed' }
      : u.state === 'refused'
        ? { icon: 'cross' as const, color: palette.fail, word: 'Refused' }
        : { icon: 'pending' as const, color: palette.inkMuted, word: `${Math.round(u.progress * 100)} %` };
  return (
    <View role="listitem" style={styles.uploadRow} testID="evidence-upload-row" accessibilityLabel={`${u.fileName}: ${look.word}`}>
      <View style={styles.uploadHead}>
        <Text variant="bodyStrong" style={{ flex: 1 }} numberOfLines={1}>
          {u.fileName}
        </Text>
        <Text variant="small" tone="muted">
          {formatBytes(u.sizeBytes)}
        </Text>
        <View style={styles.state}>
          <Icon name={look.icon} size={15} color={look.color} strokeWidth={2} />
          <Text variant="smallStrong" style={{ color: look.color }} testID="evidence-upload-state">
            {look.word}
          </Text>
        </View>
      </View>
      <View style={styles.bar} accessibilityRole="progressbar" aria-valuenow={Math.round(u.progress * 100)} aria-valuemin={0} aria-valuemax={100}>
        <View style={[styles.barFill, { width: `${Math.round(u.progress * 100)}%`, backgroundColor: u.state === 'refused' ? palette.fail : u.state === 'filed' ? palette.pass : palette.copper }]} />
      </View>
      {u.message ? (
        <Text variant="small" tone={u.state === 'refused' ? 'fail' : 'soft'} testID="evidence-upload-message">
          {u.message}
        </Text>
      ) : null}
    </View>
  );
}

function FindingsCard({ filingId, list }: { filingId: number; list: EvidenceList }) {
  if (!list.findings.length) {
    const reports = list.records.some((r) => r.category === 'test-report');
    return reports ? (
      <Notice tone="success" title="Read-back" testID="evidence-findings-none">
        No number in the test reports disagrees with the filing that Fieldfile could find. It reads tune-up powers, reported SAR, separations and the model; a table laid out unusually may be missed.
      </Notice>
    ) : null;
  }
  const open = list.findings.filter((f) => !f.explanation).length;
  return (
    <Card
      title="Read-back of the test reports"
      aside={<StatusBadge tone={open ? 'fail' : 'pass'} icon={open ? 'warning' : 'check'} label={open ? `${open} to explain` : 'All explained'} />}
      testID="evidence-findings"
    >
      <View role="list" style={styles.rows}>
        {list.findings.map((f) => (
          <FindingRow key={`${f.evidenceId}-${f.key}`} filingId={filingId} f={f} editable={list.editable} record={list.records.find((r) => r.id === f.evidenceId)} />
        ))}
      </View>
    </Card>
  );
}

function FindingRow({ filingId, f, editable, record }: { filingId: number; f: ReadBackFinding; editable: boolean; record?: EvidenceRecord }) {
  const explain = useExplainFindingMutation(filingId);
  const [reason, setReason] = useState('');
  const problem = explain.error ? asProblem(explain.error) : undefined;
  return (
    <View role="listitem" style={styles.findingRow} testID="evidence-finding">
      <View style={styles.state}>
        <Icon name={f.explanation ? 'check' : 'warning'} size={16} color={f.explanation ? palette.pass : palette.fail} strokeWidth={2} />
        <Text variant="smallStrong" style={{ color: f.explanation ? palette.pass : palette.fail }}>
          {f.explanation ? 'Explained' : 'Disagrees'}
        </Text>
      </View>
      <Text variant="body">{f.message}</Text>
      {record ? (
        <Text variant="small" tone="muted">
          {`In “${record.title}”`}
        </Text>
      ) : null}
      {f.explanation ? (
        <Text variant="small" tone="soft">{`${f.explanation.by}, ${formatDateTime(f.explanation.at)}: ${f.explanation.reason}`}</Text>
      ) : editable ? (
        <View style={styles.explain}>
          <View style={{ flex: 1, minWidth: 220 }}>
            <InputBox label="Why the difference is acceptable" value={reason} onChangeText={setReason} error={problem?.fields?.reason ?? problem?.message} testID="finding-reason" />
          </View>
          <Button
            label="Mark explained"
            variant="secondary"
            busy={explain.isPending}
            onPress={() => explain.mutate({ evidenceId: f.evidenceId, key: f.key, reason })}
            testID="finding-explain"
            style={{ alignSelf: 'flex-end' }}
          />
        </View>
      ) : null}
    </View>
  );
}

function RecordsCard({ filingId, list }: { filingId: number; list: EvidenceList }) {
  const remove = useRemoveEvidenceMutation(filingId);
  if (!list.records.length) return <Notice tone="caution">{`Nothing is filed in version ${list.version.number} yet.`}</Notice>;
  return (
    <Card
      title={`Filed in version ${list.version.number}`}
      aside={<Text variant="small" tone="muted">{`${formatBytes(list.limits.usedBytes)} of ${formatBytes(list.limits.maxFilingBytes)}`}</Text>}
      testID="evidence-records"
    >
      {remove.error ? <Notice tone="error">{asProblem(remove.error).message}</Notice> : null}
      <View role="list" style={styles.rows}>
        {list.records.map((r) => (
          <View key={r.id} role="listitem" style={styles.record} testID="evidence-record">
            <View style={styles.uploadHead}>
              <Text variant="bodyStrong" style={{ flex: 1 }}>
                {r.title}
              </Text>
              <Text variant="small" tone="copper">
                {CATEGORY_BY_ID[r.category].label}
              </Text>
            </View>
            <Text variant="small" tone="soft">
              {`${r.fileName} · ${formatBytes(r.sizeBytes)} · ${MEDIA_SHORT[r.mediaType] ?? r.mediaType}${r.documentDate ? ` · dated ${r.documentDate}` : ''}`}
            </Text>
            <Text variant="small" tone="muted">
              {`${r.uploadedBy.name}, ${formatDateTime(r.uploadedAt)}${r.carriedFromVersion ? ` · carried from version ${r.carriedFromVersion}` : ''}`}
            </Text>
            <Text variant="mono" tone="muted" selectable numberOfLines={1}>{`SHA-256 ${r.sha256}`}</Text>
            {r.note ? <Text variant="small">{r.note}</Text> : null}
            {r.duplicateOf.length ? (
              <Text variant="small" tone="caution">{`Same content as ${r.duplicateOf.map((id) => `“${list.records.find((x) => x.id === id)?.title ?? id}”`).join(', ')}.`}</Text>
            ) : null}
            <View style={styles.actions}>
              <Button label="Download" variant="secondary" compact onPress={() => globalThis.open?.(evidenceFileUrl(filingId, r.id), '_self')} testID="evidence-download" />
              {list.editable ? (
                <Button label="Remove" variant="secondary" compact busy={remove.isPending && remove.variables === r.id} onPress={() => remove.mutate(r.id)} testID="evidence-remove" />
              ) : null}
            </View>
          </View>
        ))}
      </View>
      {list.history.length ? <Text variant="small" tone="muted">{`${list.history.length} replaced file${list.history.length === 1 ? '' : 's'} kept in this version’s history.`}</Text> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.md },
  rows: { gap: space.sm },
  requiredRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: palette.line },
  state: { flexDirection: 'row', alignItems: 'center', gap: 4, minWidth: 150 },
  form: { gap: space.sm },
  formWide: { flexDirection: 'row', flexWrap: 'wrap' },
  formField: { flexGrow: 1, flexBasis: 220 },
  uploadRow: { gap: space.xxs, padding: space.sm, borderRadius: radii.md, backgroundColor: palette.paper },
  uploadHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  bar: { height: 6, borderRadius: 3, backgroundColor: palette.paperDeep, overflow: 'hidden' },
  barFill: { height: 6 },
  findingRow: { gap: space.xxs, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: palette.line },
  explain: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'flex-end' },
  record: { gap: 2, paddingVertical: space.xs, borderBottomWidth: 1, borderBottomColor: palette.line },
  actions: { flexDirection: 'row', gap: space.sm, paddingTop: space.xxs },
});
