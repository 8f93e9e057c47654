/**
 * The set-password form: the shared policy (constants/schemas/password-policy.ts) shows its
 * messages on the field before anything is sent, including "too easy to guess" for a common
 * password or one made of the person's own name; the server's 422 lands on the field too.
 */
import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { SetPasswordForm } from '../../components/auth/set-password-form';
import { apiError, installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

jest.setTimeout(30_000);

const PERSON = { email: 'ines.pardo@fieldfile.test', name: 'Ines Pardo' };

function fill(password: string, confirm = password) {
  fireEvent.changeText(screen.getByTestId('set-password-password'), password);
  fireEvent.changeText(screen.getByTestId('set-password-confirm'), confirm);
  fireEvent.press(screen.getByTestId('set-password-submit'));
}

describe('SetPasswordForm', () => {
  it('says what is wrong on the fields and sends nothing', async () => {
    const { calls } = installFetchMock({});
    renderWithClient(<SetPasswordForm token="t0k3n" person={PERSON} onDone={jest.fn()} />);

    fill('short', 'different');
    expect(await screen.findByTestId('set-password-password-error')).toHaveTextContent('Use at least 12 characters.');
    expect(screen.getByTestId('set-password-confirm-error')).toHaveTextContent('The two passwords differ.');

    fill('Password2024!');
    // The first check loads the estimator's dictionaries.
    await waitFor(() => expect(screen.getByTestId('set-password-password-error')).toHaveTextContent(/^Too easy to guess\./), { timeout: 15_000 });

    fill('InesPardo2024');
    await waitFor(() => expect(screen.getByTestId('set-password-password-error')).toHaveTextContent(/^Too easy to guess\./));
    expect(calls).toHaveLength(0);
  });

  it('sends a strong password in its NFKC form and reports the server’s refusal on the field', async () => {
    const { calls } = installFetchMock({
      'POST /api/auth/set-password': apiError(422, 'invalid_input', 'Too easy to guess.', { password: 'Too easy to guess. (from the server)' }),
    });
    const onDone = jest.fn();
    renderWithClient(<SetPasswordForm token="t0k3n" person={PERSON} onDone={onDone} />);

    fill('ｑｕｉｌｌ harbour lantern ４２', 'quill harbour lantern 42');
    expect(await screen.findByTestId('set-password-password-error')).toHaveTextContent('Too easy to guess. (from the server)');
    expect(calls).toEqual([expect.objectContaining({ method: 'POST', path: '/api/auth/set-password', body: { token: 't0k3n', password: 'quill harbour lantern 42' } })]);
    expect(onDone).not.toHaveBeenCalled();
  });
});
