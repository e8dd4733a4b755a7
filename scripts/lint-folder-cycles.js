// @ts-check
/**
 * Lint rule `tidefield/no-folder-cycle`: an import between two folders that reach each other
 * through imports (a folder-level cycle, e.g. server/lib → server/modules/auth → server/lib).
 * import-x/no-cycle catches cycles between files; this catches the coarser ones between folders,
 * which the style guide also forbids ("one-way imports; cycles are an error").
 *
 * The folder graph is built once per lint run from every source file on disk (relative
 * imports, re-exports and dynamic imports; type-only imports count, since they tie the folders'
 * designs together just the same), and its strongly connected components are computed with
 * Tarjan's algorithm. A file's import is reported when its own folder and the imported file's
 * folder differ but lie in the same component. Files inside one unit may import each other
 * freely (import-x/no-cycle guards cycles between files).
 */
import fs from 'node:fs';
import path from 'node:path';

const ROOTS = ['src', 'server', 'shared', 'tests', 'scripts', 'bench'];

/**
 * The folders that count as one unit: a file belongs to the first pattern that matches a prefix of
 * its folder ('*' is one path segment), so every subfolder of a domain module or a feature is part
 * of that module or feature; a folder outside every pattern is a unit of its own.
 */
const UNITS = ['server/modules/*', 'src/features/*', '*/*'];

/**
 * Composition roots, left out of the graph: they exist to import everything and are imported for
 * their wiring types (server/app.ts and config.ts, the Drizzle schema that gathers every module's
 * tables, the client's router and shell), so edges to and from them are not design cycles.
 * Tests, scripts and benchmarks sit outside the layering altogether.
 */
const ROOT_UNITS = new Set(['server', 'server/db', 'src', 'src/app', 'tests', 'scripts', 'bench']);

/** @param {string} rootDir @param {string} dir */
function unitOf(rootDir, dir) {
  const segments = path.relative(rootDir, dir).split(path.sep);
  for (const pattern of UNITS) {
    const parts = pattern.split('/');
    if (segments.length < parts.length) continue;
    if (parts.every((part, i) => part === '*' || part === segments[i])) return segments.slice(0, parts.length).join('/');
  }
  return segments.join('/');
}
const SOURCE = /\.(ts|tsx|mts|js|mjs)$/;
const TABLE_FILE = /\.table\.ts$/;
const TEST_FILE = /\.test\.(ts|tsx|mts|js|mjs)$/;
const SPECIFIERS = [
  /\b(?:import|export)\s[^'";]*?\sfrom\s*['"](\.{1,2}\/[^'"]+)['"]/g,
  /\bimport\s*['"](\.{1,2}\/[^'"]+)['"]/g,
  /\bimport\(\s*['"](\.{1,2}\/[^'"]+)['"]\s*\)/g,
];

/** @param {string} dir @param {string[]} out */
function walk(dir, out) {
  let entries;
  try {
    entries = fs.readdirSync(dir, { withFileTypes: true });
  } catch {
    return;
  }
  for (const entry of entries) {
    if (entry.name === 'node_modules' || entry.name.startsWith('.')) continue;
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) walk(full, out);
    // Test files sit outside the layering (they may import any folder they check).
    else if (SOURCE.test(entry.name) && !TEST_FILE.test(entry.name)) out.push(full);
  }
}

/** @param {string} file */
function relativeSpecifiers(file) {
  const text = fs.readFileSync(file, 'utf8');
  const found = new Set();
  for (const pattern of SPECIFIERS) for (const match of text.matchAll(pattern)) found.add(match[1]);
  return [...found];
}

/** @param {string} rootDir */
function buildComponents(rootDir) {
  /** @type {string[]} */
  const files = [];
  for (const root of ROOTS) walk(path.join(rootDir, root), files);
  /** @type {Map<string, Set<string>>} */
  const edges = new Map();
  for (const file of files) {
    if (ROOT_UNITS.has(unitOf(rootDir, path.dirname(file)))) continue;
    const dir = path.dirname(file);
    const from = unitOf(rootDir, dir);
    if (!edges.has(from)) edges.set(from, new Set());
    for (const spec of relativeSpecifiers(file)) {
      // A Drizzle table (`*.table.ts`) is part of the one database schema (server/db/schema.ts
      // gathers them all): reading another module's table is a data dependency, not a service one.
      if (TABLE_FILE.test(spec)) continue;
      const to = unitOf(rootDir, path.dirname(path.resolve(dir, spec)));
      if (to !== from && !ROOT_UNITS.has(to)) edges.get(from)?.add(to);
    }
  }
  // Tarjan's strongly connected components (iterative, so deep trees cannot overflow the stack).
  /** @type {Map<string, number>} */ const index = new Map();
  /** @type {Map<string, number>} */ const low = new Map();
  /** @type {Map<string, number>} */ const component = new Map();
  /** @type {string[]} */ const stack = [];
  const onStack = new Set();
  let counter = 0;
  let components = 0;
  for (const start of edges.keys()) {
    if (index.has(start)) continue;
    /** @type {Array<{ node: string, next: string[] }>} */
    const work = [];
    const enter = (/** @type {string} */ node) => {
      index.set(node, counter);
      low.set(node, counter);
      counter += 1;
      stack.push(node);
      onStack.add(node);
      work.push({ node, next: [...(edges.get(node) ?? [])] });
    };
    enter(start);
    while (work.length > 0) {
      const frame = work[work.length - 1];
      const child = frame.next.pop();
      if (child !== undefined) {
        if (!index.has(child)) enter(child);
        else if (onStack.has(child)) low.set(frame.node, Math.min(low.get(frame.node) ?? 0, index.get(child) ?? 0));
        continue;
      }
      work.pop();
      if (work.length > 0) {
        const parent = work[work.length - 1].node;
        low.set(parent, Math.min(low.get(parent) ?? 0, low.get(frame.node) ?? 0));
      }
      if (low.get(frame.node) === index.get(frame.node)) {
        let member;
        do {
          member = stack.pop();
          if (member === undefined) break;
          onStack.delete(member);
          component.set(member, components);
        } while (member !== frame.node);
        components += 1;
      }
    }
  }
  return component;
}

/** @type {Map<string, Map<string, number>>} */
const cache = new Map();

/** @type {import('eslint').Rule.RuleModule} */
export const noFolderCycle = {
  meta: {
    type: 'problem',
    docs: { description: 'Forbid imports between folders that import each other (folder-level cycles).' },
    schema: [],
    messages: {
      cycle: "Folder cycle: '{{from}}' imports '{{to}}', which (directly or through other folders) imports '{{from}}' back.",
    },
  },
  create(context) {
    // The project root: eslint.config.js passes its own folder, so linting from a subfolder works.
    const rootDir = /** @type {string | undefined} */ (context.settings['tidefield/root']) ?? context.cwd;
    let components = cache.get(rootDir);
    if (!components) {
      components = buildComponents(rootDir);
      cache.set(rootDir, components);
    }
    const graph = components;
    const fromDir = path.dirname(context.filename);
    const from = unitOf(rootDir, fromDir);
    /** @param {import('estree').Node & { source?: unknown }} node */
    function check(node) {
      const source = /** @type {{ type: string, value?: unknown } | null | undefined} */ (node.source);
      if (!source || source.type !== 'Literal' || typeof source.value !== 'string') return;
      if (!source.value.startsWith('./') && !source.value.startsWith('../')) return;
      const to = unitOf(rootDir, path.dirname(path.resolve(fromDir, source.value)));
      if (to === from) return;
      const a = graph.get(from);
      if (a === undefined || a !== graph.get(to)) return;
      context.report({
        node: /** @type {import('estree').Node} */ (source),
        messageId: 'cycle',
        data: { from, to },
      });
    }
    return {
      ImportDeclaration: check,
      ExportNamedDeclaration: check,
      ExportAllDeclaration: check,
      ImportExpression: check,
    };
  },
};
