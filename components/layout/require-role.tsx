/** Shows a screen only to holders of a role; others get a plain explanation, not a blank page. */
import type { Role } from '../../constants/schemas/roles';
import { ROLE_LABELS } from '../../constants/schemas/roles';
import { hasRole, useCurrentUser } from '../../hooks/queries/session';
import { Notice } from '../ui/notice';
import { Screen } from './screen';

export function RequireRole({ role, title, children }: { role: Role; title: string; children: React.ReactNode }) {
  const user = useCurrentUser();
  if (hasRole(user, role)) return <>{children}</>;
  return (
    <Screen title={title} testID="needs-role">
      <Notice tone="caution" title={`This page needs the ${ROLE_LABELS[role].toLowerCase()} role`}>
        {`You are signed in as ${user.email} with ${user.roles.map((r) => ROLE_LABELS[r]).join(', ') || 'no roles'}. Ask an admin of ${user.organisation.name} if you need access.`}
      </Notice>
    </Screen>
  );
}
