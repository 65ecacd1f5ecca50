/**
 * Where to send the person after sign-in. Only same-origin absolute paths are
 * accepted ("/courses?x=1"); anything else ("//host", "https://...", "/signin",
 * "javascript:...") falls back to the dashboard.
 */
export function safeReturnTo(value: string | null | undefined): string {
  if (!value) return '/';
  if (!value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/';
  // Control characters and backslashes have no place in our paths.
  if (/[\u0000-\u001f\u007f\\]/.test(value)) return '/';
  const pathname = value.split(/[?#]/, 1)[0];
  if (pathname === '/signin' || pathname.startsWith('/auth/')) return '/';
  return value;
}

/** The sign-in screen for someone who wanted `path`. */
export function signInPath(path: string): string {
  const returnTo = safeReturnTo(path);
  return returnTo === '/' ? '/signin' : `/signin?returnTo=${encodeURIComponent(returnTo)}`;
}

/** The server route that starts single sign-on and comes back to `returnTo`. */
export function loginUrl(returnTo: string | null | undefined): string {
  return `/auth/login?returnTo=${encodeURIComponent(safeReturnTo(returnTo))}`;
}
