/**
 * The (app) group's gate, with the real layouts and screens: no session → /login?next=…, and a
 * successful sign-in goes back to that page.
 */
import { fireEvent, screen, waitFor } from '@testing-library/react-native';
import { Slot } from 'expo-router';
import { renderRouter } from 'expo-router/testing-library';
import AppLayout from '../../app/(app)/_layout';
import HomeRoute from '../../app/(app)/index';
import { Text } from 'react-native';
import ProfileRoute from '../../app/(app)/profile';
import UsersRoute from '../../app/(app)/users';
import AuthLayout from '../../app/(auth)/_layout';
import LoginRoute from '../../app/(auth)/login';
import { apiError, installFetchMock } from './support/fetch-mock';
import { Providers, testQueryClient } from './support/render';

const ADMIN = { id: 1, email: 'admin@fieldfile.test', name: 'Avery Admin', roles: ['admin'], organisation: { id: 1, name: 'Demo Org' } };
const ENGINEER = { ...ADMIN, id: 3, email: 'engineer@fieldfile.test', name: 'Eli Engineer', roles: ['engineer'] };

function routes() {
  const client = testQueryClient();
  return {
    _layout: () => (
      <Providers client={client}>
        <Slot />
      </Providers>
    ),
    '(app)/_layout': AppLayout,
    '(app)/index': HomeRoute,
    '(app)/users': UsersRoute,
    // The filings list belongs to the filings feature; a stand-in keeps this test about the gate.
    '(app)/filings/index': () => <Text testID="filings-stand-in">Filings</Text>,
    '(auth)/_layout': AuthLayout,
    '(auth)/login': LoginRoute,
  };
}

// The first render of a cold run loads most of the app; small CI machines need the headroom.
jest.setTimeout(30_000);

describe('(app) layout', () => {
  it('sends a visitor without a session to /login, keeping the page asked for in `next`', async () => {
    installFetchMock({ 'GET /api/auth/me': apiError(401, 'unauthorized', 'Sign in to continue.') });
    const router = renderRouter(routes(), { initialUrl: '/users' });

    expect(await screen.findByTestId('sign-in-form')).toBeTruthy();
    expect(router.getPathname()).toBe('/login');
    expect(router.getSearchParams()).toEqual({ next: '/users' });
    expect(screen.queryByTestId('users-screen')).toBeNull();
  });

  it('goes back to `next` after signing in', async () => {
    installFetchMock({
      'GET /api/auth/me': apiError(401, 'unauthorized', 'Sign in to continue.'),
      'POST /api/auth/login': { status: 200, body: { user: ADMIN } },
      'GET /api/users': { status: 200, body: { users: [] } },
    });
    const router = renderRouter(routes(), { initialUrl: '/users' });

    fireEvent.changeText(await screen.findByTestId('sign-in-email'), 'admin@fieldfile.test');
    fireEvent.changeText(screen.getByTestId('sign-in-password'), 'fieldfile-demo-2026');
    fireEvent.press(screen.getByTestId('sign-in-submit'));

    expect(await screen.findByTestId('users-screen')).toBeTruthy();
    expect(router.getPathname()).toBe('/users');
  });

  it('shows a signed-in user the app, and a non-admin a plain "needs the admin role" page on /users', async () => {
    installFetchMock({ 'GET /api/auth/me': { status: 200, body: { user: ENGINEER } } });
    const router = renderRouter(routes(), { initialUrl: '/users' });

    expect(await screen.findByTestId('needs-role')).toBeTruthy();
    expect(screen.getByText('This page needs the admin role')).toBeTruthy();
    expect(router.getPathname()).toBe('/users');
    // The navigation offers a non-admin only what they can use.
    expect(screen.getByTestId('nav-filings')).toBeTruthy();
    expect(screen.queryByTestId('nav-people')).toBeNull();
  });

  it('sends a signed-in visitor of /login on to home, which is the filings list', async () => {
    installFetchMock({ 'GET /api/auth/me': { status: 200, body: { user: ENGINEER } } });
    const router = renderRouter(routes(), { initialUrl: '/login' });

    await waitFor(() => expect(router.getPathname()).toBe('/filings'));
    expect(await screen.findByTestId('filings-stand-in')).toBeTruthy();
  });

  it('after signing out, goes to /login without a `next`', async () => {
    installFetchMock({
      'GET /api/auth/me': { status: 200, body: { user: ENGINEER } },
      'POST /api/auth/logout': { status: 204 },
    });
    const router = renderRouter({ ...routes(), '(app)/profile': ProfileRoute }, { initialUrl: '/profile' });

    fireEvent.press(await screen.findByTestId('sign-out'));
    expect(await screen.findByTestId('sign-in-form')).toBeTruthy();
    expect(router.getPathname()).toBe('/login');
    expect(router.getSearchParams()).toEqual({});
  });
});
