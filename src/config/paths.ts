/**
 * Every route string of the client. Components link with `paths.x.getHref()`, the router
 * registers `paths.x.path`; nothing else spells a URL.
 */

const REDIRECT_PARAM = 'redirectTo';

/** A route without parameters. */
function page(path: string) {
  return { path, getHref: () => path } as const;
}

/** A sign-in/sign-up page that can send the user back to where they were afterwards. */
function authPage(path: string) {
  return {
    path,
    getHref: (redirectTo?: string | null) => {
      const target = safeRedirect(redirectTo);
      return target === paths.overview.path ? path : `${path}?${new URLSearchParams({ [REDIRECT_PARAM]: target })}`;
    },
  } as const;
}

export const paths = {
  signIn: authPage('/sign-in'),
  signUp: authPage('/sign-up'),

  overview: page('/'),
  scenarios: page('/scenarios'),
  runs: page('/runs'),
  sweeps: page('/sweeps'),
  impliedOccurrence: page('/implied-occurrence'),
  compare: page('/compare'),
  samples: page('/samples'),
  occurrenceTables: page('/occurrence-tables'),
  apiTokens: page('/api-tokens'),
  settings: page('/settings'),
  members: page('/members'),
  credits: page('/credits'),
} as const;

export type PathKey = keyof typeof paths;

/**
 * Where to go after signing in. Only same-site absolute paths are accepted ("/runs?x=1"), so a
 * crafted link cannot send a fresh session to another site ("//evil.example", "https://…").
 * The auth pages themselves are not targets: that would loop.
 */
export function safeRedirect(target: string | null | undefined): string {
  if (!target || !target.startsWith('/') || target.startsWith('//') || target.includes('\\')) {
    return paths.overview.path;
  }
  const pathname = target.split(/[?#]/, 1)[0];
  if (pathname === paths.signIn.path || pathname === paths.signUp.path) return paths.overview.path;
  return target;
}

/** Reads the redirect target from a sign-in/sign-up page's query string. */
export function redirectTargetFrom(search: URLSearchParams): string {
  return safeRedirect(search.get(REDIRECT_PARAM));
}
