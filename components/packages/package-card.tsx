/**
 * The submission package of one filing version, on the filing's overview: what a build gives
 * (the signed package, or a preview marked DRAFT), a progress bar while it builds, and the
 * finished zip with its SHA-256 and a download link.
 */
import { Linking, StyleSheet, View } from 'react-native';
import { useQueryClient } from '@tanstack/react-query';
import { palette, radii, space } from '../../constants/theme';
import { packageDownloadUrl, packageKeys, useBuildPackageMutation, useJobProgress, usePackageStatusQuery } from '../../hooks/queries/packages';
import { formatDateTime } from '../format';
import { CautionNote } from '../layout/caution-note';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { StatusBadge } from '../ui/status-badge';
import { Text } from '../ui/text';
import { Fact } from '../ui/fact';

const STAGE_LABELS: Record<string, string> = {
  queued: 'Waiting to start',
  starting: 'Starting',
  collecting: 'Collecting the version’s data',
  'exhibit-pdf': 'Laying out the exhibit PDF',
  'exhibit-docx': 'Writing the exhibit DOCX',
  results: 'Writing the results CSV',
  evidence: 'Adding the evidence files',
  finishing: 'Finishing the zip',
  done: 'Done',
};

const megabytes = (bytes: number) => (bytes < 1024 * 1024 ? `${(bytes / 1024).toFixed(0)} KB` : `${(bytes / 1024 / 1024).toFixed(1)} MB`);

export function PackageCard({ filingId, versionNumber }: { filingId: number; versionNumber: number }) {
  const queryClient = useQueryClient();
  const status = usePackageStatusQuery(filingId, versionNumber);
  const build = useBuildPackageMutation(filingId, versionNumber);
  const job = useJobProgress(build.data ?? status.data?.job, filingId, versionNumber, () => {
    void queryClient.invalidateQueries({ queryKey: packageKeys.status(filingId, versionNumber) });
  });
  const s = status.data;
  if (!s) {
    return (
      <Card title="Submission package">
        <Text tone="muted">{status.isError ? 'The package status could not be loaded.' : 'Loading…'}</Text>
      </Card>
    );
  }
  const signed = s.kind === 'signed';
  const running = !!job && (job.state === 'queued' || job.state === 'running');
  const failed = !running && job?.state === 'failed' && (!s.package || !s.upToDate);
  const ready = !!s.package && s.upToDate && !running;
  return (
    <Card
      title="Submission package"
      testID="package-card"
      aside={<StatusBadge tone={signed ? 'pass' : 'caution'} icon={signed ? 'lock' : 'warning'} label={signed ? 'Signed version' : 'DRAFT preview'} />}
    >
      <Text variant="small" tone="soft">
        {signed
          ? 'The zip for the certifying body: the RF-exposure exhibit (PDF and editable DOCX), the results as CSV, the evidence in folders and manifest.json with every SHA-256.'
          : 'This version is not signed, so its package is a preview: every page of the exhibit says DRAFT. The package without DRAFT is built when an approver signs the version.'}
      </Text>
      {running ? (
        <View style={{ gap: space.xs }} testID="package-progress">
          <View style={styles.progressRow}>
            <Text variant="smallStrong">{STAGE_LABELS[job.stage] ?? job.stage}</Text>
            <Text variant="smallStrong" testID="package-progress-percent">
              {job.percent} %
            </Text>
          </View>
          <View style={styles.track} accessibilityRole="progressbar" accessibilityLabel="Package build" accessibilityValue={{ min: 0, max: 100, now: job.percent }}>
            <View style={[styles.fill, { width: `${Math.max(2, job.percent)}%` }]} />
          </View>
        </View>
      ) : null}
      {failed ? (
        <Notice tone="error" title="The build did not finish" testID="package-failed">
          {job?.error ?? 'The build failed.'} Run it again.
        </Notice>
      ) : null}
      {s.package && !s.upToDate && !running ? (
        <Notice tone="info" title="Out of date">
          The data changed since this preview was built. Build it again to download it.
        </Notice>
      ) : null}
      {ready && s.package ? (
        <View style={{ gap: space.xs }} testID="package-ready">
          <View style={styles.facts}>
            <Fact label="File" value={s.package.fileName} />
            <Fact label="Size" value={megabytes(s.package.sizeBytes)} />
            <Fact label="Built" value={formatDateTime(s.package.builtAt)} />
          </View>
          <Text variant="small" tone="muted">
            SHA-256
          </Text>
          <Text variant="mono" selectable testID="package-sha256" style={styles.hash}>
            {s.package.sha256}
          </Text>
        </View>
      ) : null}
      <View style={styles.actions}>
        {ready && s.canDownload ? <Button label="Download the zip" icon="link" onPress={() => void Linking.openURL(packageDownloadUrl(filingId, versionNumber))} testID="package-download" /> : null}
        {s.canBuild && !running ? (
          <Button
            label={s.package ? (signed ? 'Build again' : 'Build the preview again') : signed ? 'Build the package' : 'Build a preview'}
            variant={ready ? 'secondary' : 'primary'}
            busy={build.isPending}
            busyLabel="Starting…"
            onPress={() => build.mutate()}
            testID="package-build"
          />
        ) : null}
      </View>
      {build.error ? <Notice tone="error">{build.error.message}</Notice> : null}
      {!s.canDownload ? (
        <Text variant="small" tone="muted">
          Approvers and compliance specialists download the signed package; test engineers download previews.
        </Text>
      ) : null}
      <CautionNote />
    </Card>
  );
}

const styles = StyleSheet.create({
  progressRow: { flexDirection: 'row', justifyContent: 'space-between' },
  track: { height: 10, borderRadius: radii.pill, backgroundColor: palette.paperDeep, overflow: 'hidden', borderWidth: 1, borderColor: palette.line },
  fill: { height: '100%', backgroundColor: palette.ink, borderRadius: radii.pill },
  facts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  hash: { fontSize: 12, flexShrink: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
