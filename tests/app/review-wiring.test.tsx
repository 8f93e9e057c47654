/**
 * The review's pages and forms: the order of a filing's pages and which page a path shows, the
 * words for readiness counts, the rows a comment can be about; a wrong signing password shown on
 * the password field without ending the session; asking for review refused with the blocking
 * items named; a step's comments only on that step.
 */
import { fireEvent, render, screen, waitFor } from '@testing-library/react-native';
import type { FilingDetail } from '../../constants/schemas/filings';
import { SIGNING_STATEMENT, type ReviewDto, type ReviewThreadDto } from '../../constants/schemas/review';
import { FILING_PAGES, neighbours, pageOfPath, readinessWords, rowChoices } from '../../components/filings/filing-pages';
import { CommentThreads } from '../../components/review/comment-threads';
import { RequestReviewAction, SignAction } from '../../components/review/review-actions';
import { api } from '../../hooks/api-client';
import { isSessionExpired, sessionRestored } from '../../hooks/connection-recovery';
import { reviewKeys, useReadinessFollowsFiling, type FilingReadiness } from '../../hooks/queries/review';
import { apiError, installFetchMock } from './support/fetch-mock';
import { Providers, renderWithClient, testQueryClient } from './support/render';

jest.mock('expo-router', () => ({
  Link: ({ children }: { children: React.ReactNode }) => children,
  useRouter: () => ({ push: jest.fn() }),
}));

// The first render of a cold run loads most of the app; small CI machines need the headroom.
jest.setTimeout(30_000);

const DATA: FilingDetail['data'] = {
  device: { name: 'Wren W1 crew badge', model: 'WR1-B', applicant: 'Halden Ridge Instruments', productType: 'wearable', hardwareVersion: 'A', firmwareVersion: '1.2.0' },
  radios: {
    antennas: [{ id: 'ANT-BT', gainDbi: 0.5, location: 'Top edge', rowId: 11 }],
    transmitters: [{ id: 'BT-LE', technology: 'Bluetooth LE', band: '2.4 GHz', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 4, dutyCycle: 0.35, antennaId: 'ANT-BT', rowId: 21 }],
  },
  'use-positions': { usePositions: [{ id: 'lanyard', kind: 'body-worn', separations: [{ antennaId: 'ANT-BT', separationM: 0.005 }], rowId: 31 }] },
  markets: { markets: [{ regime: 'icnirp-2020', tier: 'general' }] },
} as FilingDetail['data'];

const FILING = { id: 3, data: DATA } as FilingDetail;

const can = (allowed: string[]): ReviewDto['can'] =>
  Object.fromEntries(
    ['request-review', 'return', 'sign', 'start-next-version', 'comment', 'reply', 'resolve'].map((a) => [a, { allowed: allowed.includes(a), reason: allowed.includes(a) ? undefined : 'not you' }]),
  ) as ReviewDto['can'];

const thread = (id: number, step: string, rowRef: string | null, body: string, state: 'open' | 'resolved' = 'open'): ReviewThreadDto => ({
  id,
  step,
  rowRef,
  state,
  createdBy: { id: 4, name: 'Jonas Weber' },
  createdAt: '2026-03-02T10:00:00.000Z',
  resolvedAt: null,
  comments: [{ id: id * 10, author: { id: 4, name: 'Jonas Weber' }, body, createdAt: '2026-03-02T10:00:00.000Z' }],
});

const review = (state: ReviewDto['version']['state'], allowed: string[], threads: ReviewThreadDto[] = []): ReviewDto => ({
  filingId: 3,
  version: { id: 9, number: 1, state, createdAt: '2026-03-01T09:00:00.000Z', signature: null },
  versions: [],
  threads,
  can: can(allowed),
  signingStatement: SIGNING_STATEMENT,
});

const readiness = (blocking: { id: string; title: string; step: string }[]): FilingReadiness =>
  ({
    filingId: 3,
    version: 1,
    state: 'draft',
    ready: blocking.length === 0,
    counts: { blocking: blocking.length, warnings: 0, passed: 5, notApplicable: 1 },
    items: blocking.map((b) => ({ ...b, status: 'fail', severity: 'blocks-signing', fix: 'Fix it.', source: 'common practice', findings: [{ text: 'x' }] })),
    cautions: [],
  }) as unknown as FilingReadiness;

describe('a filing’s pages', () => {
  it('run from the wizard’s steps to Readiness and then Review and signing', () => {
    expect(FILING_PAGES.slice(-3)).toEqual(['evidence', 'readiness', 'review']);
    expect(neighbours('evidence')).toEqual({ prev: 'co-transmission', next: 'readiness' });
    expect(neighbours('readiness')).toEqual({ prev: 'evidence', next: 'review' });
    expect(neighbours('review')).toEqual({ prev: 'readiness', next: null });
    expect(neighbours('device').prev).toBeNull();
  });

  it('know which page a path shows', () => {
    expect(pageOfPath('/filings/1/readiness')).toBe('readiness');
    expect(pageOfPath('/filings/1/review')).toBe('review');
    expect(pageOfPath('/filings/1/radios')).toBe('radios');
    expect(pageOfPath('/filings/1/compare')).toBe('compare');
    expect(pageOfPath('/filings/1')).toBe('overview');
    expect(pageOfPath('/filings/1/nonsense')).toBe('overview');
  });

  it('say the readiness counts per severity in words', () => {
    expect(readinessWords({ blocking: 2, warnings: 1 })).toBe('2 block signing · 1 warning');
    expect(readinessWords({ blocking: 1, warnings: 0 })).toBe('1 blocks signing');
    expect(readinessWords({ blocking: 0, warnings: 3 })).toBe('3 warnings');
    expect(readinessWords({ blocking: 0, warnings: 0 })).toBe('Nothing blocks signing');
  });

  it('offer the rows a person typed as what a comment can be about, never the stored row ids', () => {
    expect(rowChoices(DATA, 'radios')).toEqual([
      { value: 'BT-LE', label: 'Transmitter BT-LE' },
      { value: 'ANT-BT', label: 'Antenna ANT-BT' },
    ]);
    expect(rowChoices(DATA, 'use-positions')).toEqual([{ value: 'lanyard', label: 'Use position lanyard' }]);
    expect(rowChoices(DATA, 'markets')).toEqual([{ value: 'icnirp-2020', label: 'Market ICNIRP 2020' }]);
    expect(rowChoices(DATA, 'device')).toEqual([]);
  });
});

describe('signing with a password', () => {
  afterEach(() => sessionRestored());

  it('shows a wrong password on the password field and keeps the session', async () => {
    installFetchMock({
      'POST /api/filings/3/review/sign': apiError(401, 'wrong_password', 'That password is not right; the version was not signed.', { password: 'That password is not right.' }),
    });
    renderWithClient(<SignAction filingId={3} review={review('in-review', ['sign', 'return', 'comment', 'reply'])} ready />);
    fireEvent.changeText(screen.getByTestId('sign-password'), 'not my password');
    fireEvent.press(screen.getByTestId('sign-version'));
    // The first press of a cold run loads the mutation's modules: give the answer time on a loaded machine.
    expect(await screen.findByTestId('sign-password-error', {}, { timeout: 15_000 })).toHaveTextContent('That password is not right.');
    expect(screen.queryByTestId('sign-error')).toBeNull();
    expect(isSessionExpired()).toBe(false);
  });

  it('the API client still treats any other 401 as the end of the session', async () => {
    installFetchMock({ 'GET /api/filings/3': apiError(401, 'unauthorized', 'Sign in to continue.') });
    const result = await api('/api/filings/3');
    expect(result.ok).toBe(false);
    expect(isSessionExpired()).toBe(true);
  });

  it('sends the statement the approver read with the password', async () => {
    const { calls } = installFetchMock({ 'POST /api/filings/3/review/sign': { status: 200, body: { review: review('signed', []) } } });
    renderWithClient(<SignAction filingId={3} review={review('in-review', ['sign'])} ready />);
    expect(screen.getByTestId('signing-statement')).toHaveTextContent(`“${SIGNING_STATEMENT}”`);
    fireEvent.changeText(screen.getByTestId('sign-password'), 'right password');
    fireEvent.press(screen.getByTestId('sign-version'));
    await waitFor(() => expect(calls.find((c) => c.path === '/api/filings/3/review/sign')?.body).toEqual({ password: 'right password', statement: SIGNING_STATEMENT }));
  });
});

describe('asking for review', () => {
  it('names every blocking item and keeps the button off while any stands', () => {
    installFetchMock({});
    renderWithClient(
      <RequestReviewAction
        filingId={3}
        review={review('draft', ['request-review'])}
        readiness={readiness([
          { id: 'data-complete', title: 'Device data is complete', step: 'use-positions' },
          { id: 'evidence-present', title: 'Every required evidence category is present', step: 'evidence' },
        ])}
      />,
    );
    expect(screen.getByTestId('request-review-blocked')).toHaveTextContent(/2 items block signing/);
    expect(screen.getByTestId('blocking-data-complete')).toHaveTextContent('Device data is complete — fix under Use positions');
    expect(screen.getByTestId('blocking-evidence-present')).toHaveTextContent(/fix under Evidence/);
    expect(screen.getByTestId('request-review')).toBeDisabled();
  });

  it('asks again once nothing blocks, and says which comments are still open', async () => {
    const { calls } = installFetchMock({ 'POST /api/filings/3/review/request': { status: 200, body: { review: review('in-review', []) } } });
    renderWithClient(
      <RequestReviewAction filingId={3} review={review('returned', ['request-review', 'reply', 'resolve'], [thread(1, 'radios', 'BT-LE', 'Check the power.')])} readiness={readiness([])} />,
    );
    expect(screen.getByTestId('request-review-open-threads')).toHaveTextContent(/1 comment is still open/);
    expect(screen.getByTestId('request-review')).toHaveTextContent('Ask for review again');
    fireEvent.press(screen.getByTestId('request-review'));
    await waitFor(() => expect(calls.some((c) => c.method === 'POST' && c.path === '/api/filings/3/review/request')).toBe(true));
  });

  it('is not offered to a role that cannot ask', () => {
    installFetchMock({});
    renderWithClient(<RequestReviewAction filingId={3} review={review('draft', [])} readiness={readiness([])} />);
    expect(screen.queryByTestId('request-review')).toBeNull();
  });
});

describe('comments on a step', () => {
  const threads = [
    thread(1, 'radios', 'BT-LE', 'Is 4 dBm the tune-up maximum?'),
    thread(2, 'use-positions', 'lanyard', 'Closest with the clip open?'),
    thread(3, 'radios', null, 'Gain source?', 'resolved'),
  ];

  it('show only that step’s threads, open first, and a new comment is about that step and a row', async () => {
    const { calls } = installFetchMock({ 'POST /api/filings/3/review/threads': { status: 201, body: { thread: thread(4, 'radios', 'ANT-BT', 'Where is the gain from?') } } });
    renderWithClient(<CommentThreads filing={FILING} review={review('in-review', ['comment', 'reply'], threads)} step="radios" />);
    expect(screen.getByTestId('threads-count')).toHaveTextContent('2 threads, 1 open.');
    expect(screen.queryByTestId('thread-2')).toBeNull();
    expect(screen.getByTestId('thread-1')).toBeTruthy();
    expect(screen.getByTestId('thread-3-state')).toHaveTextContent('Resolved');
    // A resolved thread takes no more answers.
    expect(screen.queryByTestId('thread-3-reply')).toBeNull();
    expect(screen.getByTestId('thread-1-reply')).toBeTruthy();

    fireEvent.press(screen.getByText('Antenna ANT-BT'));
    fireEvent.changeText(screen.getByTestId('new-thread-body'), 'Where is the gain from?');
    fireEvent.press(screen.getByTestId('new-thread-add'));
    await waitFor(() => expect(calls.find((c) => c.method === 'POST')?.body).toEqual({ step: 'radios', rowRef: 'ANT-BT', body: 'Where is the gain from?' }));
  });

  it('let the specialist answer and resolve but not start a thread', () => {
    installFetchMock({});
    renderWithClient(<CommentThreads filing={FILING} review={review('returned', ['request-review', 'reply', 'resolve'], threads)} />);
    expect(screen.getByTestId('threads-count')).toHaveTextContent('3 threads, 2 open.');
    expect(screen.getByTestId('thread-1-resolve')).toBeTruthy();
    expect(screen.getByTestId('thread-3-reopen')).toBeTruthy();
    expect(screen.queryByTestId('new-thread')).toBeNull();
  });
});

describe('the checklist follows the filing', () => {
  function Follower({ readAt }: { readAt: number }) {
    useReadinessFollowsFiling(3, readAt);
    return null;
  }

  it('is read again whenever the filing is (a save, an upload, lab data), not on the first read', () => {
    const client = testQueryClient();
    client.setQueryData(reviewKeys.readiness(3), readiness([]));
    const state = () => client.getQueryState(reviewKeys.readiness(3))!;
    const view = render(
      <Providers client={client}>
        <Follower readAt={1000} />
      </Providers>,
    );
    expect(state().isInvalidated).toBe(false);
    view.rerender(
      <Providers client={client}>
        <Follower readAt={2000} />
      </Providers>,
    );
    expect(state().isInvalidated).toBe(true);
  });
});
