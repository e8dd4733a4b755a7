import type { Rule } from 'eslint';

/** Types for lint-folder-cycles.js (plain JavaScript so that eslint.config.js can load it without a TypeScript loader). */
export declare const noFolderCycle: Rule.RuleModule;
