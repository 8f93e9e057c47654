/** The activity list in words: who was changed and what, before → after; failed sign-ins and accepted invitations named. */
import { actionLabel, describeEntry } from '../../components/users/activity-words';

const entry = (details: unknown, targetType: string | null = 'user') => ({ details, targetType, targetId: 7, filingId: null });

describe('activity words', () => {
  it('names the person changed and each change before → after, roles in words', () => {
    const text = describeEntry(entry({ roles: ['engineer', 'approver'], rolesBefore: ['engineer'], email: 'priya@example.test', targetName: 'Priya Raman' }));
    expect(text).toBe('Priya Raman (priya@example.test) · roles: Test engineer → Test engineer, Approver');
    expect(describeEntry(entry({ active: false, activeBefore: true, email: 'a@example.test', targetName: 'Ana' }))).toBe('Ana (a@example.test) · active → inactive');
    expect(describeEntry(entry({ name: 'Ana B', nameBefore: 'Ana', email: 'a@example.test', targetName: 'Ana' }))).toBe('Ana (a@example.test) · name: Ana → Ana B');
    expect(describeEntry(entry({ roles: [], rolesBefore: ['admin'], targetName: 'Ana' }))).toBe('Ana · roles: Admin → no role');
  });

  it('reads an invitation, a failed sign-in and an older entry without before values', () => {
    expect(describeEntry(entry({ email: 'new@example.test', name: 'Ada Nwosu', roles: ['engineer'] }))).toBe('Ada Nwosu · new@example.test · roles: Test engineer');
    expect(describeEntry(entry({ email: 'engineer@example.test', reason: 'wrong-password' }))).toBe('engineer@example.test');
    expect(describeEntry(entry({ roles: ['admin'] }))).toBe('roles: Admin');
    expect(describeEntry(entry(null))).toBe('user #7');
    expect(describeEntry(entry(null, null))).toBe('');
  });

  it('labels each action; a password set from an invitation is its acceptance', () => {
    expect(actionLabel('auth.sign-in-failed')).toBe('Failed sign-in');
    expect(actionLabel('user.join')).toBe('Accepted an invitation');
    expect(actionLabel('auth.set-password', { purpose: 'invitation' })).toBe('Accepted an invitation and set a password');
    expect(actionLabel('auth.set-password', { purpose: 'reset' })).toBe('Set a password');
    expect(actionLabel('filing.frobnicate')).toBe('Filing: frobnicate');
    for (const a of ['user.update', 'user.invite', 'auth.sign-in']) expect(actionLabel(a)).not.toMatch(/[.]/);
  });
});
