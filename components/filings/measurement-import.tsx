/**
 * Import the lab's measurement spreadsheet (CSV or XLSX): choose the file, see the preview with
 * every bad cell named by line and column, map columns and units when the header is not the
 * standard one, then import all rows or none. Large files show upload progress.
 */
import { useState } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { FIELD_DEFAULT_UNIT, FIELD_UNIT_KIND, IMPORT_FIELDS, REQUIRED_IMPORT_FIELDS, UNIT_FACTORS, type ImportField, type ImportMapping } from '../../constants/schemas/lab';
import { palette, radii, space } from '../../constants/theme';
import { ImportProblemError, useImportMeasurementsMutation, type ImportPreview } from '../../hooks/queries/lab';
import { asProblem } from '../../hooks/api-client';
import { Icon } from '../icons';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { SelectField } from '../ui/select-field';
import { Text } from '../ui/text';
import { SpreadsheetPicker } from './spreadsheet-picker';

const PREVIEW_SHOWN = 12;

export function MeasurementImport({ filingId }: { filingId: number }) {
  const mutation = useImportMeasurementsMutation(filingId);
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [mapping, setMapping] = useState<ImportMapping | undefined>(undefined);
  const [progress, setProgress] = useState<number | null>(null);
  const [done, setDone] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);

  const run = (f: File, dryRun: boolean, m?: ImportMapping) => {
    setError(null);
    setProgress(0);
    mutation.mutate(
      { file: f, fileName: f.name, dryRun, mapping: m, onProgress: setProgress },
      {
        onSuccess: (p) => {
          setProgress(null);
          setPreview(p);
          if (!dryRun) {
            setDone(p.imported);
            setFile(null);
          }
        },
        onError: (err) => {
          setProgress(null);
          if (err instanceof ImportProblemError && err.preview) setPreview(err.preview);
          else setPreview(null);
          setError(asProblem(err).message);
        },
      },
    );
  };

  const pick = (f: File) => {
    setFile(f);
    setDone(null);
    setMapping(undefined);
    run(f, true);
  };
  const needsMapping = !!preview && (preview.mappingSource === 'guessed' || preview.problems.some((p) => p.line === 1));
  const clean = !!preview && preview.dryRun && preview.problems.length === 0 && preview.rowCount > 0;

  return (
    <View style={styles.wrap} testID="lab-import">
      <Text tone="soft">The lab’s table as CSV (comma, semicolon or tab; decimal commas are recognised) or XLSX. A file with the standard header needs no mapping:</Text>
      <Text variant="mono" style={styles.header} selectable>
        {IMPORT_FIELDS.slice(0, 15).join(',')}
      </Text>
      <SpreadsheetPicker onPick={pick} label={file ? 'Choose another file…' : undefined} />
      {file ? (
        <Text variant="small" tone="muted" testID="lab-import-file">
          {file.name} · {(file.size / 1024).toFixed(file.size < 10240 ? 1 : 0)} KB
        </Text>
      ) : null}
      {progress !== null ? <Progress fraction={progress} /> : null}
      {done !== null ? (
        <Notice tone="success" title={`${done} measurement${done === 1 ? '' : 's'} imported`} testID="lab-import-done">
          The results below are recomputed from them.
        </Notice>
      ) : null}
      {error ? (
        <Notice tone="error" title={error} testID="lab-import-error">
          {preview?.problems.length ? 'Nothing was imported. Fix the cells named below in the file and choose it again.' : null}
        </Notice>
      ) : null}
      {preview && done === null ? <PreviewBlock preview={preview} /> : null}
      {preview && needsMapping && file ? (
        <MappingEditor headers={preview.headers} mapping={mapping ?? preview.mapping} onChange={setMapping} onCheck={() => run(file, true, mapping ?? preview.mapping)} busy={mutation.isPending} />
      ) : null}
      {clean && file ? (
        <Button
          label={`Import ${preview.rowCount} row${preview.rowCount === 1 ? '' : 's'}`}
          icon="check"
          onPress={() => run(file, false, preview.mappingSource === 'given' ? preview.mapping : mapping)}
          busy={mutation.isPending}
          busyLabel="Importing…"
          testID="lab-import-submit"
          style={{ alignSelf: 'flex-start' }}
        />
      ) : null}
    </View>
  );
}

function Progress({ fraction }: { fraction: number }) {
  const pct = Math.round(fraction * 100);
  return (
    <View style={{ gap: space.xxs }} testID="lab-import-progress" accessibilityRole="progressbar" accessibilityValue={{ min: 0, max: 100, now: pct }}>
      <View style={styles.bar}>
        <View style={[styles.barFill, { width: `${pct}%` }]} />
      </View>
      <Text variant="small" tone="muted">
        {pct < 100 ? `Uploading… ${pct} %` : 'Checking every row…'}
      </Text>
    </View>
  );
}

function PreviewBlock({ preview }: { preview: ImportPreview }) {
  const bad = new Map<string, string>();
  for (const p of preview.problems) if (p.field) bad.set(`${p.line}|${p.field}`, p.message);
  const fields = (Object.keys(preview.mapping) as ImportField[]).filter((f) => preview.mapping[f]);
  const rows = [...preview.rows.filter((r) => preview.problems.some((p) => p.line === r.line)), ...preview.rows.filter((r) => !preview.problems.some((p) => p.line === r.line))].slice(
    0,
    PREVIEW_SHOWN,
  );
  const describe = `${preview.format.toUpperCase()}${preview.delimiter ? `, “${preview.delimiter === '\t' ? 'tab' : preview.delimiter}”-separated` : ''}${preview.decimalComma ? ', decimal commas' : ''} · ${preview.rowCount} row${preview.rowCount === 1 ? '' : 's'} · columns ${MAPPING_SOURCE[preview.mappingSource]}`;
  return (
    <View style={{ gap: space.sm }} testID="lab-import-preview">
      <Text variant="small" tone="soft" testID="lab-import-summary">
        {describe}
      </Text>
      {preview.problems.length ? (
        <View role="list" style={styles.problems} testID="lab-import-problems">
          <Text variant="smallStrong" style={{ color: palette.fail }}>
            {preview.problems.length} problem{preview.problems.length === 1 ? '' : 's'} — nothing is imported until every one is fixed
          </Text>
          {preview.problems.slice(0, 50).map((p, i) => (
            <View key={i} role="listitem" style={styles.problem} testID={`lab-import-problem-${i}`}>
              <Icon name="cross" size={14} color={palette.fail} strokeWidth={2} />
              <Text variant="mono" style={styles.where}>
                line {p.line}
                {p.column ? `, ${p.column}` : ''}
              </Text>
              <Text variant="small" style={{ flex: 1, minWidth: 180 }}>
                {p.message}
              </Text>
            </View>
          ))}
          {preview.problems.length > 50 ? (
            <Text variant="small" tone="muted">
              …and {preview.problems.length - 50} more.
            </Text>
          ) : null}
        </View>
      ) : (
        <Notice tone="success" title="Every row reads cleanly" testID="lab-import-clean">
          Nothing is stored until you press Import.
        </Notice>
      )}
      {rows.length && fields.length ? (
        <ScrollView horizontal style={styles.previewScroll} contentContainerStyle={{ flexGrow: 1 }}>
          <View role="table" accessibilityLabel="Preview of the file">
            <View role="row" style={[styles.pr, styles.prHead]}>
              <Text variant="smallStrong" tone="soft" style={styles.lineCell} role="columnheader">
                Line
              </Text>
              {fields.map((f) => (
                <Text key={f} variant="smallStrong" tone="soft" style={styles.pc} role="columnheader" numberOfLines={2}>
                  {preview.mapping[f]!.column}
                  {preview.mapping[f]!.unit ? ` (${preview.mapping[f]!.unit})` : ''}
                </Text>
              ))}
            </View>
            {rows.map((r) => (
              <View key={r.line} role="row" style={styles.pr}>
                <Text variant="mono" style={styles.lineCell} role="cell">
                  {r.line}
                </Text>
                {fields.map((f) => {
                  const message = bad.get(`${r.line}|${f}`);
                  return (
                    <View
                      key={f}
                      style={[styles.pc, message ? styles.badCell : null]}
                      role="cell"
                      accessibilityLabel={message ? `Line ${r.line}, ${preview.mapping[f]!.column}: ${message}` : undefined}
                      testID={message ? `bad-cell-${r.line}-${f}` : undefined}
                    >
                      <Text variant="small" numberOfLines={1}>
                        {r.cells[f] ?? ''}
                      </Text>
                      {message ? (
                        <View style={styles.badTag}>
                          <Icon name="cross" size={11} color={palette.fail} strokeWidth={2.2} />
                          <Text variant="small" style={{ color: palette.fail, fontSize: 11 }}>
                            bad
                          </Text>
                        </View>
                      ) : null}
                    </View>
                  );
                })}
              </View>
            ))}
          </View>
        </ScrollView>
      ) : null}
    </View>
  );
}

const MAPPING_SOURCE: Record<ImportPreview['mappingSource'], string> = {
  header: 'read from the standard header',
  remembered: 'mapped as your organisation did before for this header',
  given: 'mapped as you chose',
  guessed: 'guessed from the header — check the mapping',
};

function MappingEditor({ headers, mapping, onChange, onCheck, busy }: { headers: string[]; mapping: ImportMapping; onChange: (m: ImportMapping) => void; onCheck: () => void; busy: boolean }) {
  const columnOptions = [{ value: '', label: '— not in the file —' }, ...headers.map((h) => ({ value: h, label: h }))];
  const set = (f: ImportField, patch: { column?: string; unit?: string }) => {
    const next = { ...mapping };
    const column = patch.column ?? mapping[f]?.column ?? '';
    if (!column) delete next[f];
    else next[f] = { column, unit: patch.unit ?? mapping[f]?.unit ?? FIELD_DEFAULT_UNIT[f] };
    onChange(next);
  };
  return (
    <View style={styles.mapping} testID="lab-import-mapping">
      <Text variant="bodyStrong">Map the file’s columns</Text>
      <Text variant="small" tone="soft">
        Pick the column for each field and the unit its values are in; required fields are marked *. Fieldfile remembers this mapping for files with the same header.
      </Text>
      {IMPORT_FIELDS.map((f) => {
        const kind = FIELD_UNIT_KIND[f];
        return (
          <View key={f} style={styles.mapRow}>
            <Text variant="mono" style={styles.mapField}>
              {f}
              {REQUIRED_IMPORT_FIELDS.includes(f) ? ' *' : ''}
            </Text>
            <View style={{ flex: 2, minWidth: 160 }}>
              <SelectField label={`Column for ${f}`} hideLabel options={columnOptions} value={mapping[f]?.column ?? ''} onChange={(v) => set(f, { column: v })} testID={`map-${f}`} />
            </View>
            {kind ? (
              <View style={{ flex: 1, minWidth: 90 }}>
                <SelectField
                  label={`Unit of ${f}`}
                  hideLabel
                  options={Object.keys(UNIT_FACTORS[kind]).map((u) => ({ value: u, label: u }))}
                  value={mapping[f]?.unit ?? FIELD_DEFAULT_UNIT[f] ?? ''}
                  onChange={(v) => set(f, { unit: v })}
                  testID={`map-${f}-unit`}
                />
              </View>
            ) : (
              <View style={{ flex: 1, minWidth: 90 }} />
            )}
          </View>
        );
      })}
      <Button label="Check the file with this mapping" variant="secondary" onPress={onCheck} busy={busy} busyLabel="Checking…" testID="lab-import-recheck" style={{ alignSelf: 'flex-start' }} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  header: { fontSize: 11, color: palette.inkSoft, backgroundColor: palette.paper, padding: space.sm, borderRadius: radii.sm },
  bar: { height: 8, borderRadius: radii.pill, backgroundColor: palette.paperDeep, overflow: 'hidden' },
  barFill: { height: 8, backgroundColor: palette.copper },
  problems: { gap: space.xs, borderWidth: 1, borderColor: '#E6C1BD', backgroundColor: palette.failSoft, borderRadius: radii.md, padding: space.md },
  problem: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  where: { fontSize: 12, color: palette.fail, minWidth: 130 },
  previewScroll: { borderWidth: 1, borderColor: palette.line, borderRadius: radii.md },
  pr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: palette.paperDeep, minHeight: 34, alignItems: 'stretch' },
  prHead: { backgroundColor: palette.paper },
  lineCell: { width: 48, padding: space.xs, fontSize: 12 },
  pc: { width: 118, padding: space.xs, justifyContent: 'center' },
  badCell: { backgroundColor: palette.failSoft, borderWidth: 1, borderColor: palette.fail },
  badTag: { flexDirection: 'row', alignItems: 'center', gap: 2 },
  mapping: { gap: space.sm, borderWidth: 1, borderColor: palette.line, borderRadius: radii.md, padding: space.md, backgroundColor: palette.paper },
  mapRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  mapField: { flex: 1.4, minWidth: 150, fontSize: 12 },
});
