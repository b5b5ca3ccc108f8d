/**
 * The signed-in person is shared by the shell, the account page and the invitation page,
 * which are separate features; they meet on this one cache key instead of importing each other.
 */
export const sessionKeys = {
  me: () => ['session', 'me'] as const,
};

/** Only same-site paths may be used as a post-sign-in destination (no open redirects). */
export function safeNextPath(next: string | null | undefined, fallback = '/campaigns'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  return next;
}

export function signInPath(next: string): string {
  return next === '/' ? '/sign-in' : `/sign-in?next=${encodeURIComponent(next)}`;
}
