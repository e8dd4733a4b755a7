import { describe, expect, it } from 'vitest';
import { paths, redirectTargetFrom, safeRedirect } from './paths.ts';

describe('paths', () => {
  it('gives every page a distinct absolute path equal to its href', () => {
    const all = Object.values(paths);
    expect(new Set(all.map((p) => p.path)).size).toBe(all.length);
    for (const page of all) {
      expect(page.path).toMatch(/^\/[a-z-]*$/);
      expect(page.getHref()).toBe(page.path);
    }
  });

  it('carries the page to return to through sign-in and sign-up', () => {
    expect(paths.signIn.getHref('/runs?status=done')).toBe('/sign-in?redirectTo=%2Fruns%3Fstatus%3Ddone');
    expect(redirectTargetFrom(new URLSearchParams('redirectTo=%2Fruns%3Fstatus%3Ddone'))).toBe('/runs?status=done');
    expect(paths.signUp.getHref('/members')).toBe('/sign-up?redirectTo=%2Fmembers');
    // The overview is where sign-in goes anyway: no parameter.
    expect(paths.signIn.getHref('/')).toBe('/sign-in');
  });

  it('never redirects off the site or back into the auth pages', () => {
    for (const target of ['https://evil.example/', '//evil.example', '/\\evil.example', 'javascript:alert(1)', '', null, undefined]) {
      expect(safeRedirect(target)).toBe('/');
    }
    expect(safeRedirect('/sign-in?redirectTo=/x')).toBe('/');
    expect(safeRedirect('/sign-up')).toBe('/');
    expect(safeRedirect('/samples#top')).toBe('/samples#top');
  });
});
