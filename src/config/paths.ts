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
  forgotPassword: page('/forgot-password'),
  // Opened from e-mailed links, which carry ?token=….
  resetPassword: page('/reset-password'),
  acceptInvitation: page('/accept-invitation'),
  // Opened from the link mailed to a new e-mail address (?token=…).
  confirmEmail: page('/confirm-email'),
  // Opened from the link mailed after sign-up (?token=…): creates the account.
  confirmSignUp: page('/confirm-sign-up'),

  overview: page('/'),
  scenarios: {
    ...page('/scenarios'),
    /** The builder; with a preset key it starts from that example scenario. */
    new: { path: '/scenarios/new', getHref: (preset?: string) => (preset ? `/scenarios/new?preset=${encodeURIComponent(preset)}` : '/scenarios/new') },
    detail: { path: '/scenarios/:id', getHref: (id: string) => `/scenarios/${encodeURIComponent(id)}` },
  },
  runs: {
    ...page('/runs'),
    /** The start form, with the scenario chosen when one is given. */
    new: {
      path: '/runs/new',
      getHref: (scenarioId?: string) => (scenarioId ? `/runs/new?scenario=${encodeURIComponent(scenarioId)}` : '/runs/new'),
      /** Run a run's own scenario document again (a sweep's point with its values). */
      again: (runId: string) => `/runs/new?again=${encodeURIComponent(runId)}`,
    },
    detail: { path: '/runs/:id', getHref: (id: string) => `/runs/${encodeURIComponent(id)}` },
  },
  sweeps: {
    ...page('/sweeps'),
    detail: { path: '/sweeps/:id', getHref: (id: string) => `/sweeps/${encodeURIComponent(id)}` },
  },
  fits: {
    ...page('/fits'),
    detail: { path: '/fits/:id', getHref: (id: string) => `/fits/${encodeURIComponent(id)}` },
  },
  impliedOccurrence: {
    ...page('/implied-occurrence'),
    /** A question already asked: the fit over the multiplier that answers it. */
    withFit: (fitId: string) => `/implied-occurrence?${new URLSearchParams({ fit: fitId })}`,
    /** A question asked before implied occurrence was a fit: the run that answered it and the sample. */
    withRun: (runId: string, sampleId: string) =>
      `/implied-occurrence?${new URLSearchParams({ run: runId, sample: sampleId })}`,
  },
  compare: {
    ...page('/compare'),
    /** Two to four runs side by side: /compare?runs=a,b. */
    withRuns: (ids: readonly string[]) => `/compare?runs=${ids.map(encodeURIComponent).join(',')}`,
  },
  samples: {
    ...page('/samples'),
    new: page('/samples/new'),
    detail: { path: '/samples/:id', getHref: (id: string) => `/samples/${encodeURIComponent(id)}` },
  },
  occurrenceTables: {
    ...page('/occurrence-tables'),
    detail: { path: '/occurrence-tables/:id', getHref: (id: string) => `/occurrence-tables/${encodeURIComponent(id)}` },
  },
  constraintSets: page('/constraint-sets'),
  twoSample: page('/two-sample'),
  apiTokens: page('/api-tokens'),
  settings: page('/settings'),
  members: page('/members'),
  credits: page('/credits'),
  outbox: page('/outbox'),
  workers: page('/workers'),
} as const;

/** Addresses of pages that moved, still reached through old links and e-mails. */
export const MOVED_PAGES: readonly { from: string; to: string }[] = [{ from: '/notifications', to: '/settings#notices' }];

/** Pages outside the signed-in app (no navigation entry). */
export const PUBLIC_PAGE_KEYS: readonly PathKey[] = ['signIn', 'signUp', 'forgotPassword', 'resetPassword', 'acceptInvitation', 'confirmEmail', 'confirmSignUp'];

/**
 * A read-only share link to a run or sweep, opened without signing in. Kept beside `paths`
 * (not in it) because it is never a navigation target: the server makes these URLs.
 */
export const sharedPath = { path: '/shared/:token', getHref: (token: string) => `/shared/${encodeURIComponent(token)}` } as const;

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
