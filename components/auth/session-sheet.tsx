/**
 * When the session ends mid-work, a sign-in sheet opens over the current screen instead of
 * sending the person to the sign-in page: the screen, and whatever was typed on it, stays, and
 * the edits that could not be saved are sent again once they are signed in.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCurrentUser } from '../../hooks/queries/session';
import { sessionRestored, useSessionExpired } from '../../hooks/connection-recovery';
import { Sheet } from '../ui/sheet';
import { SignInForm } from './sign-in-form';

export function SessionSheet() {
  const expired = useSessionExpired();
  const user = useCurrentUser();
  const queryClient = useQueryClient();
  return (
    <Sheet
      visible={expired}
      title="Sign in again to carry on"
      subtitle="Your session has ended. What you typed is kept on this screen and is saved as soon as you have signed in."
      testID="session-sheet"
    >
      <SignInForm
        initialEmail={user.email}
        keepScreen
        onSignedIn={() => {
          sessionRestored();
          void queryClient.invalidateQueries({ predicate: (q) => q.state.status === 'error' });
        }}
      />
    </Sheet>
  );
}
