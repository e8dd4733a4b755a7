import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ESLint } from 'eslint';
import { afterAll, describe, expect, it } from 'vitest';
import { noFolderCycle } from './lint-folder-cycles.js';

// The style guide's import boundaries (shared/STYLE.md "One-way imports") checked against the
// project's own eslint.config.js: each probe is a line that breaks one rule, linted as if it lived
// at the given path, and must be reported by that rule; the allowed counterpart must pass.
const repo = path.resolve(import.meta.dirname, '..');
const eslint = new ESLint({ cwd: repo });

async function rulesHit(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(repo, filePath) });
  return result.messages.map((m) => m.ruleId ?? m.message);
}

describe('import boundaries in eslint.config.js', { timeout: 60_000 }, () => {
  it('shared/ never imports src/ or server/', async () => {
    expect(await rulesHit('shared/contracts/probe.ts', "import { formatDate } from '../../src/lib/format.ts';\nvoid formatDate;\n")).toContain('import-x/no-restricted-paths');
    expect(await rulesHit('shared/contracts/probe.ts', "import { AppError } from '../../server/lib/errors.ts';\nvoid AppError;\n")).toContain('import-x/no-restricted-paths');
  });

  it('shared/engine imports no Node module, React, Express or Drizzle, and uses no DOM globals', async () => {
    for (const line of [
      "import { readFileSync } from 'node:fs';\nvoid readFileSync;\n",
      "import { readFileSync } from 'fs';\nvoid readFileSync;\n",
      "import { useState } from 'react';\nvoid useState;\n",
      "import express from 'express';\nvoid express;\n",
      "import { eq } from 'drizzle-orm';\nvoid eq;\n",
    ]) {
      expect(await rulesHit('shared/engine/physics/probe.ts', line), line).toContain('no-restricted-imports');
    }
    expect(await rulesHit('shared/engine/physics/probe.ts', 'export const width = window.innerWidth;\n')).toContain('no-restricted-globals');
    expect(await rulesHit('shared/engine/physics/probe.ts', 'export const twice = (x: number): number => 2 * x;\n')).toEqual([]);
  });

  it('client features never import each other; shared client folders are fine', async () => {
    const features = "import { getSamples } from '../../samples/api/get-samples.ts';\nvoid getSamples;\n";
    expect(await rulesHit('src/features/runs/components/probe.ts', features)).toContain('import-x/no-restricted-paths');
    expect(await rulesHit('src/features/runs/components/probe.ts', "import { cx } from '../../../lib/class-names.ts';\nvoid cx;\n")).not.toContain('import-x/no-restricted-paths');
  });

  it('only the session module imports lucia', async () => {
    expect(await rulesHit('server/modules/auth/probe.ts', "import { Lucia } from 'lucia';\nvoid Lucia;\n")).toContain('no-restricted-imports');
    expect(await rulesHit('server/modules/runs/probe.ts', "import { DrizzleMySQLAdapter } from '@lucia-auth/adapter-drizzle';\nvoid DrizzleMySQLAdapter;\n")).toContain('no-restricted-imports');
    expect(await rulesHit('shared/engine/probe.ts', "import { Lucia } from 'lucia';\nvoid Lucia;\n")).toContain('no-restricted-imports');
    expect(await rulesHit('server/modules/auth/session.ts', "import { Lucia } from 'lucia';\nvoid Lucia;\n")).not.toContain('no-restricted-imports');
  });
});

describe('tidefield/no-folder-cycle', { timeout: 60_000 }, () => {
  const root = mkdtempSync(path.join(tmpdir(), 'folder-cycle-'));
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  function write(file: string, text: string) {
    mkdirSync(path.dirname(path.join(root, file)), { recursive: true });
    writeFileSync(path.join(root, file), text);
  }

  it('reports both ends of a cycle between two modules and nothing on a one-way import', async () => {
    // a → b → c → a through three modules (no file-level cycle: three different files), and d → a one way.
    write('server/modules/a/a.service.ts', "import { b } from '../b/b.service.ts';\nexport const a = () => b;\n");
    write('server/modules/a/a.table.ts', 'export const table = 1;\n');
    write('server/modules/b/b.service.ts', "import { c } from '../c/c.service.ts';\nexport const b = () => c;\n");
    write('server/modules/c/c.service.ts', "import { h } from '../a/sub/helper.ts';\nexport const c = () => h;\n");
    // Reading another module's Drizzle table is a data dependency of the one schema, not a cycle: e → a.table while a → e.
    write('server/modules/e/e.service.ts', "import { table } from '../a/a.table.ts';\nexport const e = () => table;\n");
    write('server/modules/a/uses-e.ts', "import { e } from '../e/e.service.ts';\nexport const ue = e;\n");
    write('server/modules/d/d.service.ts', "import { a } from '../a/a.service.ts';\nexport const d = () => a;\n");
    // A subfolder belongs to its module: a/sub → a is no cycle.
    write('server/modules/a/sub/helper.ts', "import { table } from '../a.table.ts';\nexport const h = table;\n");
    write('server/modules/a/uses-sub.ts', "import { h } from './sub/helper.ts';\nexport const u = h;\n");
    const linter = new ESLint({
      cwd: root,
      overrideConfigFile: true,
      overrideConfig: [
        {
          files: ['**/*.ts'],
          plugins: { tidefield: { rules: { 'no-folder-cycle': noFolderCycle } } },
          rules: { 'tidefield/no-folder-cycle': 'error' },
        },
      ],
    });
    const results = await linter.lintFiles(['server']);
    const reported = results
      .filter((r) => r.messages.length > 0)
      .map((r) => path.relative(root, r.filePath))
      .sort();
    expect(reported).toEqual(['server/modules/a/a.service.ts', 'server/modules/b/b.service.ts', 'server/modules/c/c.service.ts']);
    for (const r of results) for (const m of r.messages) expect(m.ruleId).toBe('tidefield/no-folder-cycle');
  });
});
