/**
 * The profile's change-password form: the shared policy's messages on the fields before sending,
 * a wrong current password from the server on its field, and what happened after a change.
 */
import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { ChangePasswordForm } from '../../components/auth/change-password-form';
import { apiError, installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

jest.setTimeout(30_000);

function fill(current: string, next: string, confirm = next) {
  fireEvent.changeText(screen.getByTestId('change-password-current'), current);
  fireEvent.changeText(screen.getByTestId('change-password-new'), next);
  fireEvent.changeText(screen.getByTestId('change-password-confirm'), confirm);
  fireEvent.press(screen.getByTestId('change-password-submit'));
}

describe('ChangePasswordForm', () => {
  it('checks the new password against the policy and the current one before sending', async () => {
    const { calls } = installFetchMock({});
    renderWithClient(<ChangePasswordForm email="mira@fieldfile.test" name="Mira Okafor" />);

    fill('', 'MiraOkafor2024', 'something else');
    // The first check loads the estimator's dictionaries.
    expect(await screen.findByTestId('change-password-current-error', {}, { timeout: 15_000 })).toHaveTextContent('Enter your current password.');
    await waitFor(() => expect(screen.getByTestId('change-password-new-error')).toHaveTextContent(/^Too easy to guess\./));
    expect(screen.getByTestId('change-password-confirm-error')).toHaveTextContent('The two passwords differ.');

    fill('heron slate orchard 7', 'heron slate orchard 7');
    await waitFor(() => expect(screen.getByTestId('change-password-new-error')).toHaveTextContent('Choose a password other than your current one.'));
    expect(calls).toHaveLength(0);
  });

  it('puts a wrong current password on its field, then reports the change and clears the form', async () => {
    let attempt = 0;
    installFetchMock({
      'POST /api/auth/change-password': () =>
        ++attempt === 1 ? apiError(422, 'invalid_input', 'That is not your current password.', { currentPassword: 'That is not your current password.' }) : { status: 200, body: { sessionsEnded: 2 } },
    });
    renderWithClient(<ChangePasswordForm email="mira@fieldfile.test" name="Mira Okafor" />);

    fill('not it', 'lantern quarry bicycle 5');
    expect(await screen.findByTestId('change-password-current-error')).toHaveTextContent('That is not your current password.');

    fill('heron slate orchard 7', 'lantern quarry bicycle 5');
    expect(await screen.findByTestId('change-password-done')).toHaveTextContent(/Use the new one next time you sign in\. 2 other sessions were signed out\.$/);
    expect(screen.getByTestId('change-password-current').props.value).toBe('');
  });
});
