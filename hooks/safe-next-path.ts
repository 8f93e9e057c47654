/**
 * The `next` parameter of /login, accepted only as a path inside the app, so a crafted link
 * cannot send someone elsewhere after they sign in.
 */
export function safeNextPath(next: unknown): string {
  const value = Array.isArray(next) ? next[0] : next;
  if (typeof value !== 'string' || !value.startsWith('/') || value.startsWith('//') || value.includes('\\')) return '/';
  if (value === '/login' || value.startsWith('/login?') || value.startsWith('/set-password')) return '/';
  return value;
}
