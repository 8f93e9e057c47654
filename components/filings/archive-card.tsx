/**
 * Archive or restore a filing, on its overview: shown to its owner (who created it) and to
 * admins, the people the server lets do it. An archived filing is read-only until restored.
 */
import { useState } from 'react';
import type { FilingDetail } from '../../constants/schemas/filings';
import { asProblem } from '../../hooks/api-client';
import { useArchiveFilingMutation } from '../../hooks/queries/filings';
import { hasRole, useCurrentUser } from '../../hooks/queries/session';
import { formatDateTime } from '../format';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';

export function ArchiveCard({ filing }: { filing: FilingDetail }) {
  const user = useCurrentUser();
  const mutation = useArchiveFilingMutation(filing.id);
  const [confirming, setConfirming] = useState(false);
  if (filing.owner.id !== user.id && !hasRole(user, 'admin')) return null;
  const archived = Boolean(filing.archivedAt);
  return (
    <Card title={archived ? 'Archived filing' : 'Archive'} testID="archive-card">
      <Text variant="small" tone="soft">
        {archived
          ? `Archived ${formatDateTime(filing.archivedAt!)}. It is read-only and hidden from the filings list (shown with “Show archived”). Restore it to work on it again.`
          : 'Archiving hides the filing from the filings list and makes it read-only; nothing is deleted, and you or an admin can restore it.'}
      </Text>
      {mutation.isError ? <Notice tone="error">{asProblem(mutation.error).message}</Notice> : null}
      {archived ? (
        <Button
          label="Restore filing"
          icon="check"
          onPress={() => mutation.mutate('restore')}
          busy={mutation.isPending}
          busyLabel="Restoring…"
          style={{ alignSelf: 'flex-start' }}
          testID="filing-restore"
        />
      ) : confirming ? (
        <>
          <Notice tone="caution" title={`Archive “${filing.device.name}”?`}>
            It leaves the list and becomes read-only until restored.
          </Notice>
          <Button
            label="Archive filing"
            variant="danger"
            onPress={() =>
              mutation.mutate('archive', {
                onSettled: () => setConfirming(false),
              })
            }
            busy={mutation.isPending}
            busyLabel="Archiving…"
            style={{ alignSelf: 'flex-start' }}
            testID="filing-archive-confirm"
          />
          <Button label="Keep it" variant="quiet" onPress={() => setConfirming(false)} style={{ alignSelf: 'flex-start' }} testID="filing-archive-cancel" />
        </>
      ) : (
        <Button label="Archive filing" variant="secondary" onPress={() => setConfirming(true)} style={{ alignSelf: 'flex-start' }} testID="filing-archive" />
      )}
    </Card>
  );
}
