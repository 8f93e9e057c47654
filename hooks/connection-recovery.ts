/**
 * What the app does when a request fails for a reason that passes: the session ended (401) or
 * the server could not be reached. Nothing typed is dropped: callers register a resend, run when
 * the person has signed in again (the sign-in sheet calls `sessionRestored`) or when the
 * connection is back (the browser's `online` event, or a periodic try).
 */
import { useSyncExternalStore } from 'react';
import { Platform } from 'react-native';

/** How often an offline save is tried again when the browser gives no `online` event. */
export const OFFLINE_RETRY_MS = 5_000;

let expired = false;
const listeners = new Set<() => void>();
const resumeAfterSignIn = new Set<() => void>();

function emit() {
  for (const l of listeners) l();
}

/** Any signed-in request answered 401: the session has ended under the person's feet. */
export function markSessionExpired(): void {
  if (expired) return;
  expired = true;
  emit();
}

export function isSessionExpired(): boolean {
  return expired;
}

/** The sign-in sheet: signed in again; run every waiting resend. */
export function sessionRestored(): void {
  expired = false;
  emit();
  const waiting = [...resumeAfterSignIn];
  resumeAfterSignIn.clear();
  for (const fn of waiting) fn();
}

export function useSessionExpired(): boolean {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => expired,
    () => false,
  );
}

/** Run `fn` once the person has signed in again. Returns a cancel function. */
export function whenSignedInAgain(fn: () => void): () => void {
  resumeAfterSignIn.add(fn);
  return () => resumeAfterSignIn.delete(fn);
}

/** Run `fn` once the connection seems back: the `online` event, or after OFFLINE_RETRY_MS. Returns a cancel function. */
export function whenBackOnline(fn: () => void, retryMs = OFFLINE_RETRY_MS): () => void {
  let done = false;
  const web = Platform.OS === 'web' && typeof window !== 'undefined';
  const run = () => {
    if (done) return;
    done = true;
    cancel();
    fn();
  };
  const timer = setTimeout(run, retryMs);
  if (web) window.addEventListener('online', run);
  const cancel = () => {
    clearTimeout(timer);
    if (web) window.removeEventListener('online', run);
  };
  return () => {
    done = true;
    cancel();
  };
}
