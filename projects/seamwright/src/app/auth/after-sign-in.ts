/** Where to go after signing in or up: `next` when it is a path on this site, else the pattern list. */
export function afterSignIn(next: string | undefined): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/patterns';
}
