/**
 * Import a device description file (fieldfile.device/1): pick a file (web) or paste its JSON.
 * A refused file lists every problem with its JSON path; nothing is created then. A file imported
 * before (the server's check) or a model that already has a filing is said once; pressing Import
 * again creates the second filing.
 */
import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, TextInput, View } from 'react-native';
import { DEVICE_FILE_FORMAT } from '../../constants/schemas/device-file';
import { fonts, palette, radii, space } from '../../constants/theme';
import { asProblem, type ApiProblem } from '../../hooks/api-client';
import { useFilingsQuery, useImportFilingMutation } from '../../hooks/queries/filings';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { FilePicker } from './file-picker';

export function ImportDeviceFile() {
  const router = useRouter();
  const importFile = useImportFilingMutation();
  const [text, setText] = useState('');
  const [fileName, setFileName] = useState<string | null>(null);
  const [parseError, setParseError] = useState<string | null>(null);
  /** Why this may be a second filing of the same device: said once; the next press imports anyway. */
  const [duplicateNote, setDuplicateNote] = useState<string | null>(null);
  const existing = useFilingsQuery('', 'updated');
  const problem: ApiProblem | null = importFile.isError ? asProblem(importFile.error) : null;

  const submit = () => {
    setParseError(null);
    importFile.reset();
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (e) {
      setParseError(`This is not JSON: ${(e as Error).message}`);
      return;
    }
    const device = (json as { device?: { name?: unknown; model?: unknown } } | null)?.device;
    const same = existing.data?.find((f) => typeof device?.model === 'string' && f.device.model.trim().toLowerCase() === device.model.trim().toLowerCase());
    if (same && !duplicateNote) {
      setDuplicateNote(`“${same.device.name}” (model ${same.device.model}) is already a filing. Importing creates a second, separate filing; to change the existing one, open it instead.`);
      return;
    }
    importFile.mutate(
      { file: json, refuseDuplicate: !duplicateNote },
      {
        onSuccess: (filing) => router.replace(`/filings/${filing.id}`),
        onError: (e) => {
          const p = asProblem(e);
          if (p.code !== 'duplicate_import') return;
          importFile.reset();
          setDuplicateNote(p.message);
        },
      },
    );
  };

  return (
    <View style={styles.wrap} testID="import-device-file">
      <Text tone="soft">
        A JSON file in Fieldfile’s own device format ({DEVICE_FILE_FORMAT}): device, markets, antennas, transmitters, use positions. Its schema is published at /api/schema/device.json.
      </Text>
      <FilePicker
        onPick={(name, content) => {
          setFileName(name);
          setText(content);
          setParseError(null);
          setDuplicateNote(null);
          importFile.reset();
        }}
      />
      {fileName ? (
        <Text variant="small" tone="muted">
          Loaded {fileName}; you can still edit it below.
        </Text>
      ) : null}
      <TextInput
        accessibilityLabel="Device file JSON"
        multiline
        value={text}
        onChangeText={(t) => {
          setText(t);
          setDuplicateNote(null);
        }}
        placeholder={`{ "format": "${DEVICE_FILE_FORMAT}", "device": { … } }`}
        placeholderTextColor={palette.inkFaint}
        style={styles.json}
        testID="import-json"
        autoCorrect={false}
        autoCapitalize="none"
        spellCheck={false}
      />
      {duplicateNote ? (
        <Notice tone="caution" title="This device may already have a filing" testID="import-duplicate">
          {`${duplicateNote} Press “Import as a second filing” to create it anyway.`}
        </Notice>
      ) : null}
      {parseError ? (
        <Notice tone="error" title="Nothing was imported">
          {parseError}
        </Notice>
      ) : null}
      {problem ? (
        <Notice tone="error" title={problem.message} testID="import-problems">
          {problem.fields ? (
            <View role="list" style={styles.problems}>
              {Object.entries(problem.fields).map(([path, message]) => (
                <View key={path} role="listitem" style={styles.problem}>
                  <Text variant="mono" style={styles.path}>
                    {path === '_' ? '(whole file)' : path}
                  </Text>
                  <Text variant="small" style={{ flex: 1, minWidth: 160 }}>
                    {message}
                  </Text>
                </View>
              ))}
            </View>
          ) : null}
        </Notice>
      ) : null}
      <Button
        label={duplicateNote ? 'Import as a second filing' : 'Import and create filing'}
        icon="plus"
        onPress={submit}
        disabled={!text.trim()}
        busy={importFile.isPending}
        busyLabel="Importing…"
        testID="import-submit"
        style={{ alignSelf: 'flex-start' }}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  json: {
    minHeight: 160,
    borderWidth: 1,
    borderColor: palette.lineStrong,
    borderRadius: radii.md,
    backgroundColor: palette.surface,
    padding: space.md,
    fontFamily: fonts.mono,
    fontSize: 13,
    color: palette.ink,
    textAlignVertical: 'top',
  },
  problems: { gap: space.xs, paddingTop: space.xs },
  problem: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'baseline' },
  path: { color: palette.fail, fontSize: 12 },
});
