/** The sign-in form: the shared zLogin messages, and the server's answers shown in place. */
import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { SignInForm } from '../../components/auth/sign-in-form';
import { sessionKeys, type SessionState } from '../../hooks/queries/session';
import { apiError, installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

const ADA = { id: 7, email: 'ada@fieldfile.test', name: 'Ada Demo', roles: ['specialist'], organisation: { id: 1, name: 'Demo Org' } };

// The first render of a cold run loads most of the app; small CI machines need the headroom.
jest.setTimeout(30_000);

describe('SignInForm', () => {
  it('shows the schema’s messages and sends nothing when the fields are empty or malformed', async () => {
    const { calls } = installFetchMock({});
    renderWithClient(<SignInForm />);

    fireEvent.press(screen.getByTestId('sign-in-submit'));
    expect(await screen.findByText('Enter an e-mail address.')).toBeTruthy();
    expect(screen.getByText('Enter your password.')).toBeTruthy();

    fireEvent.changeText(screen.getByTestId('sign-in-email'), 'not-an-address');
    fireEvent.press(screen.getByTestId('sign-in-submit'));
    expect(await screen.findByText('Enter a valid e-mail address, like name@example.com.')).toBeTruthy();
    expect(calls).toHaveLength(0);
  });

  it('shows a 401 from the server as the form’s error, not on a field', async () => {
    installFetchMock({ 'POST /api/auth/login': apiError(401, 'unauthorized', 'The e-mail or password is not right.') });
    renderWithClient(<SignInForm />);

    fireEvent.changeText(screen.getByTestId('sign-in-email'), 'ada@fieldfile.test');
    fireEvent.changeText(screen.getByTestId('sign-in-password'), 'wrong password');
    fireEvent.press(screen.getByTestId('sign-in-submit'));

    const error = await screen.findByTestId('sign-in-error');
    expect(error).toHaveTextContent('The e-mail or password is not right.');
    expect(screen.queryByTestId('sign-in-email-error')).toBeNull();
    expect(screen.queryByTestId('sign-in-password-error')).toBeNull();
  });

  it('puts a 422’s field messages on the fields', async () => {
    installFetchMock({
      'POST /api/auth/login': apiError(422, 'invalid_input', 'Please fix the highlighted fields.', { email: 'This address is not allowed here.' }),
    });
    renderWithClient(<SignInForm />);

    fireEvent.changeText(screen.getByTestId('sign-in-email'), 'ada@fieldfile.test');
    fireEvent.changeText(screen.getByTestId('sign-in-password'), 'whatever');
    fireEvent.press(screen.getByTestId('sign-in-submit'));

    expect(await screen.findByTestId('sign-in-email-error')).toHaveTextContent('This address is not allowed here.');
    expect(screen.getByTestId('sign-in-error')).toHaveTextContent('Please fix the highlighted fields.');
  });

  it('sends the normalised e-mail and stores the signed-in user on success', async () => {
    const { calls } = installFetchMock({ 'POST /api/auth/login': { status: 200, body: { user: ADA } } });
    const { client } = renderWithClient(<SignInForm />);

    fireEvent.changeText(screen.getByTestId('sign-in-email'), '  Ada@Fieldfile.TEST ');
    fireEvent.changeText(screen.getByTestId('sign-in-password'), 'correct horse battery');
    fireEvent.press(screen.getByTestId('sign-in-submit'));

    await waitFor(() => expect(client.getQueryData<SessionState>(sessionKeys.me())?.user?.email).toBe('ada@fieldfile.test'));
    expect(calls).toEqual([expect.objectContaining({ method: 'POST', path: '/api/auth/login', body: { email: 'ada@fieldfile.test', password: 'correct horse battery' } })]);
    expect(screen.queryByTestId('sign-in-error')).toBeNull();
  });

  it('offers "Forgot your password?" carrying the e-mail typed so far', async () => {
    installFetchMock({});
    renderWithClient(<SignInForm />);
    const link = () => screen.getByTestId('forgot-password-link');
    expect(link()).toHaveTextContent('Forgot your password?');
    expect(link().props.href).toBe('/forgot-password');

    fireEvent.changeText(screen.getByTestId('sign-in-email'), ' ada@fieldfile.test ');
    await waitFor(() => expect(link().props.href).toBe('/forgot-password?email=ada%40fieldfile.test'));
  });

  it('leaves the link out when signing in again over an open screen', () => {
    installFetchMock({});
    renderWithClient(<SignInForm keepScreen />);
    expect(screen.queryByTestId('forgot-password-link')).toBeNull();
  });
});
