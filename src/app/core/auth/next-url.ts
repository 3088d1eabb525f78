/**
 * The page to open after sign-in. Only paths inside this app are allowed, so a crafted
 * link cannot send someone elsewhere after they type their password.
 */
export function safeNextUrl(next: string | null | undefined): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  if (next.startsWith('/sign-in')) return '/';
  return next;
}
