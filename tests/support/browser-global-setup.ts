/**
 * Global setup of the browser suite: Debian's Chromium (installed when missing) and a fresh
 * client build, so the tests drive the real built app. The MariaDB server comes from
 * global-setup.ts, which this project also lists.
 */
import type { TestProject } from 'vitest/node';
import { ensureChromium } from '../../scripts/chromium.ts';
import { buildClientIfStale } from '../../scripts/client-build.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    chromiumPath: string;
  }
}

export default function setup(project: TestProject) {
  project.provide('chromiumPath', ensureChromium());
  buildClientIfStale(() => {});
}
