/**
 * /verify: is this zip (or this SHA-256) a package Fieldfile issued, for which filing and
 * version, and which files differ from its manifest?
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { palette, space } from '../../constants/theme';
import { useVerifyHashMutation, useVerifyZipMutation, type VerifyResultDto } from '../../hooks/queries/packages';
import { Screen } from '../layout/screen';
import { ZipPicker } from '../packages/zip-picker';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { InputBox } from '../ui/input-box';
import { Notice } from '../ui/notice';
import { StatusBadge, type BadgeTone } from '../ui/status-badge';
import { Text } from '../ui/text';
import type { IconName } from '../icons';

const VERDICT_LOOK: Record<VerifyResultDto['verdict'], { tone: BadgeTone; icon: IconName; label: string }> = {
  intact: { tone: 'pass', icon: 'check', label: 'Matches' },
  differs: { tone: 'fail', icon: 'cross', label: 'Files differ' },
  unknown: { tone: 'caution', icon: 'warning', label: 'Not recognised' },
};

const FILE_LOOK: Record<VerifyResultDto['files'][number]['status'], { tone: BadgeTone; icon: IconName; label: string }> = {
  ok: { tone: 'pass', icon: 'check', label: 'Matches' },
  changed: { tone: 'fail', icon: 'cross', label: 'Changed' },
  missing: { tone: 'fail', icon: 'cross', label: 'Missing' },
  'not-in-manifest': { tone: 'caution', icon: 'warning', label: 'Not in manifest' },
};

const HEX64 = /^[0-9a-fA-F]{64}$/;

export function PackageVerifyScreen() {
  const [hash, setHash] = useState('');
  const [hashError, setHashError] = useState<string | undefined>();
  const [fileName, setFileName] = useState<string | null>(null);
  const byHash = useVerifyHashMutation();
  const byZip = useVerifyZipMutation();
  const latest = fileName ? byZip : byHash;
  const result = latest.data;

  const checkHash = () => {
    const value = hash.trim();
    if (!HEX64.test(value)) return setHashError('Give the SHA-256 as 64 hexadecimal characters (0–9, a–f).');
    setHashError(undefined);
    setFileName(null);
    byHash.mutate(value.toLowerCase());
  };

  return (
    <Screen eyebrow="Packages" title="Verify a package" subtitle="Check a zip you received or sent against what Fieldfile issued." testID="verify-screen">
      <Card title="The zip">
        <Text variant="small" tone="soft">
          Fieldfile reads its manifest and checks every file’s SHA-256. Nothing you upload is kept.
        </Text>
        <ZipPicker
          onPick={(file) => {
            setFileName(file.name);
            byZip.mutate(file);
          }}
        />
        {fileName ? (
          <Text variant="small" tone="muted" testID="verify-file-name">
            {byZip.isPending ? `Checking ${fileName}…` : fileName}
          </Text>
        ) : null}
      </Card>
      <Card title="Or its SHA-256">
        <InputBox label="SHA-256 of the zip" value={hash} onChangeText={setHash} error={hashError} autoCapitalize="none" autoCorrect={false} testID="verify-hash" />
        <Button label="Check the hash" variant="secondary" onPress={checkHash} busy={byHash.isPending} busyLabel="Checking…" style={{ alignSelf: 'flex-start' }} testID="verify-hash-submit" />
      </Card>
      {latest.error ? (
        <Notice tone="error" title="Could not check it" testID="verify-error">
          {latest.error.message}
        </Notice>
      ) : null}
      {result ? <VerifyResult result={result} /> : null}
    </Screen>
  );
}

function VerifyResult({ result }: { result: VerifyResultDto }) {
  const look = VERDICT_LOOK[result.verdict];
  const differing = result.files.filter((f) => f.status !== 'ok');
  return (
    <Card title="Result" aside={<StatusBadge tone={look.tone} icon={look.icon} label={look.label} testID="verify-verdict" />} testID="verify-result">
      <Text testID="verify-message">{result.message}</Text>
      {result.package ? (
        <Text variant="small" tone="soft">
          {result.package.device} · filing {result.package.filingId}, version {result.package.versionNumber} ·{' '}
          {result.signed ? 'signed package' : result.package.kind === 'signed' ? 'signed package, altered' : 'DRAFT preview'}
        </Text>
      ) : null}
      <Text variant="mono" selectable style={{ fontSize: 12 }}>
        SHA-256 {result.sha256}
      </Text>
      {result.files.length ? (
        <View style={{ gap: space.xs }}>
          <Text variant="smallStrong" tone="soft">
            {differing.length ? `${differing.length} of ${result.files.length} files differ` : `All ${result.files.length} files match the manifest`}
          </Text>
          {(differing.length ? differing : result.files).map((f) => (
            <View key={f.path} style={styles.fileRow} testID="verify-file-row">
              <StatusBadge {...FILE_LOOK[f.status]} />
              <Text variant="mono" style={styles.path}>
                {f.path}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  fileRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap', paddingVertical: space.xxs, borderBottomWidth: 1, borderBottomColor: palette.paperDeep },
  path: { fontSize: 12, flexShrink: 1 },
});
