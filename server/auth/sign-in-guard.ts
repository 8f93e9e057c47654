/**
 * The sign-in guard: how many passwords may be tried, from where, and how many are checked at once.
 *
 * Limits (rate-limiter-flexible, in this process's memory; one point per attempt, taken before
 * the password is hashed, given back when the password was right):
 * - one account from one address: a person mistyping, or a guesser aiming at one account;
 * - one address over every account: a guesser spraying common passwords over many accounts;
 * - one account from every address together: a guess spread over many machines. When this one
 *   closes it closes for the owner too (nothing tells them apart), so its message offers the
 *   password reset, which opens it again.
 * Each answers 429 with Retry-After and a sentence saying when to try again, after a second's
 * wait (REFUSAL_DELAY_MS) that slows a guesser down without holding anything. The limits count
 * every e-mail address alike, known or not, so a 429 says nothing about whether an account exists.
 *
 * Concurrency: from one address one sign-in checks its password at a time and a few wait in line;
 * the next is told "busy" at once (429, Retry-After: 1) without touching a limit or a hash. Over
 * all addresses at most SIGN_IN_IN_FLIGHT_MAX sign-ins are in progress. Hashes themselves are
 * bounded by HASH_CONCURRENCY in server/services/passwords.ts, so a flood from one address holds
 * at most one hash slot and the owner's sign-in from elsewhere finds one free.
 *
 * The numbers are our own choice ("common practice" in the sense of OWASP's Authentication
 * Cheat Sheet, which asks for throttling without fixing figures): generous enough that a person
 * who forgot which password they used does not notice, small enough that guessing is hopeless
 * against passwords that pass the policy (constants/schemas/password-policy.ts).
 */
import { RateLimiterMemory, RateLimiterRes } from 'rate-limiter-flexible';
import { tooManyRequests } from '../http-error';

export const SIGN_IN_LIMITS = {
  /** Wrong passwords for one account from one address. */
  accountFromAddress: { points: 10, duration: 15 * 60, blockDuration: 15 * 60 },
  /** Wrong passwords from one address, every account together. */
  address: { points: 100, duration: 60 * 60, blockDuration: 60 * 60 },
  /** Wrong passwords for one account, every address together. */
  account: { points: 100, duration: 60 * 60, blockDuration: 60 * 60 },
} as const;

/** From one address: one sign-in checks its password, this many wait; the next is "busy". */
export const SIGN_IN_QUEUE_PER_ADDRESS = 2;
/** Sign-ins in progress (checking or waiting) over every address; the next is "busy". */
export const SIGN_IN_IN_FLIGHT_MAX = 32;

/** How long a "too many" answer waits before it is sent. */
export const REFUSAL_DELAY_MS = 1000;

export type LimitScope = keyof typeof SIGN_IN_LIMITS;

/** "in 40 seconds", "in 15 minutes": when the caller may try again. */
export function retryInWords(ms: number): string {
  const seconds = Math.max(1, Math.ceil(ms / 1000));
  if (seconds < 60) return `in ${seconds} second${seconds === 1 ? '' : 's'}`;
  const minutes = Math.ceil(seconds / 60);
  return `in ${minutes} minute${minutes === 1 ? '' : 's'}`;
}

const BLOCKED_MESSAGE: Record<LimitScope, (when: string) => string> = {
  accountFromAddress: (when) => `Too many wrong passwords for this account. Try again ${when}, or reset your password by e-mail.`,
  account: (when) => `Too many wrong passwords for this account. Try again ${when}, or reset your password by e-mail.`,
  address: (when) => `Too many sign-in attempts from your network. Try again ${when}.`,
};

export const BUSY_MESSAGE = 'Sign-in is busy: other attempts from your network are being checked. Try again in a moment.';

/**
 * The key for an address: an IPv4 address as it is, an IPv6 address by its /64 prefix (one
 * subscriber usually holds a whole /64, so counting single addresses would not limit them).
 */
export function addressKey(address: string | undefined): string {
  if (!address) return 'unknown';
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(address);
  if (mapped) return mapped[1];
  if (!address.includes(':')) return address;
  const [head, tail = ''] = address.split('%')[0].split('::');
  const left = head ? head.split(':') : [];
  const right = address.includes('::') && tail ? tail.split(':') : [];
  const groups = address.includes('::') ? [...left, ...Array(Math.max(0, 8 - left.length - right.length)).fill('0'), ...right] : left;
  return `${groups
    .slice(0, 4)
    .map((g) => (parseInt(g, 16) || 0).toString(16))
    .join(':')}::/64`;
}

type Lease = Pick<Admission, 'turn' | 'release'>;

/** One password check at a time per address, a short line behind it, a cap over all addresses. */
function createAddressGate() {
  const lines = new Map<string, { active: boolean; waiting: (() => void)[] }>();
  let inFlight = 0;
  return {
    enter(key: string): Lease | undefined {
      const line = lines.get(key) ?? { active: false, waiting: [] };
      if (inFlight >= SIGN_IN_IN_FLIGHT_MAX) return undefined;
      if (line.active && line.waiting.length >= SIGN_IN_QUEUE_PER_ADDRESS) return undefined;
      lines.set(key, line);
      inFlight += 1;
      let active = !line.active;
      let wake: () => void = () => undefined;
      const turn = active ? Promise.resolve() : new Promise<void>((resolve) => (wake = resolve));
      const waiter = () => {
        active = true;
        wake();
      };
      if (active) line.active = true;
      else line.waiting.push(waiter);
      let released = false;
      return {
        turn,
        release() {
          if (released) return;
          released = true;
          inFlight -= 1;
          if (!active) {
            // Left the line before its turn (refused by a limit, or the client went away).
            line.waiting.splice(line.waiting.indexOf(waiter), 1);
            return;
          }
          const next = line.waiting.shift();
          if (next) next();
          else {
            line.active = false;
            lines.delete(key);
          }
        },
      };
    },
    load: () => ({ inFlight, addresses: lines.size }),
  };
}

export interface SignInAttempt {
  /** The e-mail as typed, normalised (trimmed, lower case). */
  email: string;
  /** The client's address (req.ip). */
  address: string | undefined;
}

export interface Admission {
  /** Resolves when it is this sign-in's turn to check its password. */
  turn: Promise<void>;
  succeeded(): Promise<void>;
  /** Frees the place in the address's line (idempotent). */
  release(): void;
}

export interface SignInGuardOptions {
  /** Called once when a limit closes for an account (for its organisations' audit trails). */
  onAccountBlocked?: (attempt: SignInAttempt, scope: Exclude<LimitScope, 'address'>) => void;
}

export function createSignInGuard(options: SignInGuardOptions = {}) {
  const limiters = {
    accountFromAddress: new RateLimiterMemory({
      keyPrefix: 'sign-in-account-address',
      ...SIGN_IN_LIMITS.accountFromAddress,
    }),
    address: new RateLimiterMemory({
      keyPrefix: 'sign-in-address',
      ...SIGN_IN_LIMITS.address,
    }),
    account: new RateLimiterMemory({
      keyPrefix: 'sign-in-account',
      ...SIGN_IN_LIMITS.account,
    }),
  };
  const gate = createAddressGate();
  /** Bumped when an account's password is reset: its per-address counts start afresh. */
  const generation = new Map<string, number>();
  const keysOf = (a: SignInAttempt) => {
    const address = addressKey(a.address);
    return {
      address,
      account: a.email,
      accountFromAddress: `${a.email}#${generation.get(a.email) ?? 0} ${address}`,
    };
  };

  /** Takes one point from each limit, the widest first; a closed limit stops the rest. */
  async function consume(a: SignInAttempt): Promise<void> {
    const keys = keysOf(a);
    for (const scope of ['address', 'accountFromAddress', 'account'] as const) {
      try {
        await limiters[scope].consume(keys[scope]);
      } catch (rejection) {
        if (!(rejection instanceof RateLimiterRes)) throw rejection;
        // The first refusal is the moment the limit closed: tell the account's organisations once.
        if (scope !== 'address' && rejection.consumedPoints === SIGN_IN_LIMITS[scope].points + 1) options.onAccountBlocked?.(a, scope);
        throw tooManyRequests('too_many_attempts', BLOCKED_MESSAGE[scope](retryInWords(rejection.msBeforeNext)), rejection.msBeforeNext / 1000);
      }
    }
  }

  /**
   * Lets a sign-in in or throws a 429: "busy" when its address already has one checking and a
   * full line, "too many" when a limit is closed. Both come before any hash. The admission must
   * be released (the sign-in route does it when the answer is sent).
   */
  async function admit(a: SignInAttempt): Promise<Admission> {
    const lease = gate.enter(addressKey(a.address));
    if (!lease) throw tooManyRequests('busy', BUSY_MESSAGE, 1);
    try {
      await consume(a);
    } catch (err) {
      lease.release();
      // The refusal waits a moment (with its place in line given up): a guesser that waits for
      // answers, as most do, is slowed to one try per second per connection.
      await new Promise((r) => setTimeout(r, REFUSAL_DELAY_MS));
      throw err;
    }
    return {
      turn: lease.turn,
      release: lease.release,
      /** The password was right: its points come back and this address's count for the account clears. */
      async succeeded() {
        const keys = keysOf(a);
        await Promise.all([limiters.address.reward(keys.address), limiters.account.reward(keys.account), limiters.accountFromAddress.delete(keys.accountFromAddress)]);
      },
    };
  }

  return {
    admit,

    /**
     * A password was reset by mail: the account's limits open again from every address (the
     * reset link proved who asks). The address limit stays.
     */
    async forgetAccount(email: string): Promise<void> {
      generation.set(email, (generation.get(email) ?? 0) + 1);
      await limiters.account.delete(email);
    },

    load: () => gate.load(),
  };
}

export type SignInGuard = ReturnType<typeof createSignInGuard>;

/**
 * Reset-link requests: from one address at most RESET_REQUEST_LIMITS.address an hour (then 429,
 * which says nothing about any account); for one e-mail address at most
 * RESET_REQUEST_LIMITS.email links an hour, beyond which the request is answered as always but
 * no mail goes out (so nobody can fill an inbox, and nobody learns that they tried to).
 */
export const RESET_REQUEST_LIMITS = {
  address: { points: 10, duration: 60 * 60 },
  email: { points: 3, duration: 60 * 60 },
} as const;

export function createResetRequestLimits() {
  const byAddress = new RateLimiterMemory({ keyPrefix: 'reset-address', ...RESET_REQUEST_LIMITS.address });
  const byEmail = new RateLimiterMemory({ keyPrefix: 'reset-email', ...RESET_REQUEST_LIMITS.email });
  return {
    /** Throws a 429 for an address over its limit; false when this e-mail has had its links for the hour. */
    async admit(email: string, address: string | undefined): Promise<boolean> {
      try {
        await byAddress.consume(addressKey(address));
      } catch (rejection) {
        if (!(rejection instanceof RateLimiterRes)) throw rejection;
        throw tooManyRequests('too_many_attempts', `Too many reset requests from your network. Try again ${retryInWords(rejection.msBeforeNext)}.`, rejection.msBeforeNext / 1000);
      }
      try {
        await byEmail.consume(email);
        return true;
      } catch (rejection) {
        if (!(rejection instanceof RateLimiterRes)) throw rejection;
        return false;
      }
    },
  };
}
