/** The invite form: shared zCreateUser messages, role checkboxes, and the server's answers. */
import { fireEvent, screen } from '@testing-library/react-native';
import { InviteUserForm } from '../../components/users/invite-user-form';
import { apiError, installFetchMock } from './support/fetch-mock';
import { renderWithClient } from './support/render';

const created = (body: { email: string; name: string; roles: string[] }) => ({
  status: 201,
  body: {
    user: { id: 9, ...body, active: true, invitationPending: true, createdAt: '2026-03-01T10:00:00.000Z', lastSignInAt: null },
    invitation: { sent: true },
  },
});

// The first render of a cold run loads most of the app; small CI machines need the headroom.
jest.setTimeout(30_000);

describe('InviteUserForm', () => {
  it('asks for a name, an e-mail and at least one role before sending anything', async () => {
    const { calls } = installFetchMock({});
    renderWithClient(<InviteUserForm />);

    fireEvent.press(screen.getByTestId('invite-submit'));
    expect(await screen.findByText('Enter a name.')).toBeTruthy();
    expect(screen.getByText('Enter an e-mail address.')).toBeTruthy();
    expect(screen.getByTestId('invite-role-error')).toHaveTextContent('Pick at least one role.');
    expect(calls).toHaveLength(0);
  });

  it('sends the chosen roles in their canonical order and confirms the invitation', async () => {
    const { calls } = installFetchMock({ 'POST /api/users': ({ body }) => created(body as never) });
    renderWithClient(<InviteUserForm />);

    fireEvent.changeText(screen.getByTestId('invite-name'), 'Rosa Reviewer');
    fireEvent.changeText(screen.getByTestId('invite-email'), 'Rosa@Example.com');
    fireEvent.press(screen.getByTestId('invite-role-approver'));
    fireEvent.press(screen.getByTestId('invite-role-engineer'));
    fireEvent.press(screen.getByTestId('invite-role-admin'));
    fireEvent.press(screen.getByTestId('invite-role-admin')); // and unticked again
    expect(screen.getByTestId('invite-role-engineer')).toBeChecked();
    expect(screen.getByTestId('invite-role-admin')).not.toBeChecked();
    fireEvent.press(screen.getByTestId('invite-submit'));

    expect(await screen.findByTestId('invite-sent')).toHaveTextContent(/Rosa Reviewer \(rosa@example\.com\) has a link/);
    expect(calls).toEqual([expect.objectContaining({ method: 'POST', path: '/api/users', body: { name: 'Rosa Reviewer', email: 'rosa@example.com', roles: ['engineer', 'approver'] } })]);
    // The form is cleared for the next person.
    expect(screen.getByTestId('invite-name').props.value).toBe('');
  });

  it('puts a 409 on the e-mail field', async () => {
    installFetchMock({
      'POST /api/users': apiError(409, 'conflict', 'Someone with this e-mail is already a member.', { email: 'Someone with this e-mail is already a member.' }),
    });
    renderWithClient(<InviteUserForm />);

    fireEvent.changeText(screen.getByTestId('invite-name'), 'Eli Again');
    fireEvent.changeText(screen.getByTestId('invite-email'), 'engineer@fieldfile.test');
    fireEvent.press(screen.getByTestId('invite-role-engineer'));
    fireEvent.press(screen.getByTestId('invite-submit'));

    expect(await screen.findByTestId('invite-email-error')).toHaveTextContent('Someone with this e-mail is already a member.');
    // The same words are not repeated above the button.
    expect(screen.queryByTestId('invite-error')).toBeNull();
    expect(screen.queryByTestId('invite-sent')).toBeNull();
  });
});
