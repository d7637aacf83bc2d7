/** Where to go after signing in: only paths inside Lotwise are followed. */
export function safeNextPath(next: string | null | undefined, fallback = '/'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/sign-in'))
    return fallback;
  return next;
}
