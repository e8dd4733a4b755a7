import { doiOf } from '../../../shared/contracts/method-choices.ts';

/**
 * BibTeX entries from the free-text references of a methods list ("Surname, I. Year, Journal,
 * Volume, Page[, note]", several joined by "; "). Journal references become @article with
 * volume, pages and the DOI where one is known; books and other works become @misc with the
 * text as title. Lines without a year ("definition", "user supplied", "common practice") are
 * not references and are left out. UTF-8 is kept (biber and BibTeX 0.99 with inputenc read it).
 */
export interface BibEntry {
  key: string;
  type: 'article' | 'misc';
  fields: Record<string, string>;
}

const CITATION = /^(?<authors>.+?),? (?<year>\d{4})[a-z]?, (?<rest>.+)$/;
const JOURNAL = /^(?<journal>[^,]+), (?<volume>\d+), (?<pages>[A-Z]?\d+)(?:, (?<note>.+)| (?<paren>\(.+\)))?$/;

/** Every distinct reference of the methods (split at "; "), in first-use order. */
export function distinctReferences(references: readonly string[]): string[] {
  const out: string[] = [];
  for (const r of references) for (const part of r.split('; ')) if (!out.includes(part.trim())) out.push(part.trim());
  return out;
}

function authorsOf(text: string): string {
  const others = /,? et al\.$/.test(text);
  const names = text.replace(/,? et al\.$/, '').replace(/ & /g, ', ').split(', ');
  const people: string[] = [];
  // "Surname, I. I." pairs; a lone word (e.g. an organisation) stands alone.
  for (let i = 0; i < names.length; i++) {
    const next = names[i + 1];
    if (next && /^(?:[A-Z][a-z]?\.[- ]?)+$/u.test(next.replace(/\s/g, ''))) {
      people.push(`${names[i]}, ${next}`);
      i++;
    } else people.push(names[i]);
  }
  if (others) people.push('others');
  return people.join(' and ');
}

function keyOf(authors: string, year: string, taken: Set<string>): string {
  const surname = authors.split(',')[0];
  const base = surname.normalize('NFD').replace(/[^A-Za-z]/g, '') + year;
  let key = base;
  for (let n = 0; taken.has(key); n++) key = base + String.fromCharCode(97 + n);
  taken.add(key);
  return key;
}

export function bibEntries(references: readonly string[]): BibEntry[] {
  const taken = new Set<string>();
  const entries: BibEntry[] = [];
  for (const reference of distinctReferences(references)) {
    const m = CITATION.exec(reference);
    if (!m?.groups) continue;
    const { authors, year, rest } = m.groups;
    const doi = doiOf(reference);
    const key = keyOf(authors, year, taken);
    const j = JOURNAL.exec(rest);
    const common = { author: authorsOf(authors), year, ...(doi ? { doi } : {}) };
    if (j?.groups) {
      const note = j.groups.note ?? j.groups.paren?.slice(1, -1);
      entries.push({ key, type: 'article', fields: { ...common, journal: j.groups.journal, volume: j.groups.volume, pages: j.groups.pages, ...(note ? { note } : {}) } });
    } else {
      entries.push({ key, type: 'misc', fields: { ...common, title: rest } });
    }
  }
  return entries;
}

const escape = (value: string) => value.replace(/([&%$#_])/g, '\\$1');

export function toBibtex(entries: readonly BibEntry[], header: string): string {
  const body = entries.map((e) => {
    const fields = Object.entries(e.fields).map(([k, v]) => `  ${k} = {${k === 'doi' ? v : escape(v)}}`);
    return `@${e.type}{${e.key},\n${fields.join(',\n')}\n}`;
  });
  return [header.split('\n').map((l) => `% ${l}`).join('\n'), ...body].join('\n\n') + '\n';
}
