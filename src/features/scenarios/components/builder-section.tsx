import type { ReactNode } from 'react';
import { Card } from '../../../components/ui/card.tsx';
import type { FieldIssue } from '../../../../shared/contracts/field-issues.ts';

/** The builder's sections, in order: where each sits on the page and which document keys it holds. */
export const BUILDER_SECTIONS = [
  { id: 'run', title: 'Run', keys: ['title', 'description', 'seed', 'systems', 'scenario'] },
  { id: 'primaries', title: 'Primaries', keys: ['primaries'] },
  { id: 'companions', title: 'Companions', keys: ['companions'] },
  { id: 'giant', title: 'Giant phase', keys: ['giant'] },
  { id: 'envelope', title: 'Common envelope', keys: ['envelope'] },
  { id: 'disruption', title: 'Disruption', keys: ['disruption'] },
  { id: 'field', title: 'Field', keys: ['field'] },
  { id: 'channels', title: 'Channels', keys: ['channels'] },
  { id: 'selection', title: 'Selection', keys: ['selection', 'observed'] },
] as const;

export type BuilderSectionId = (typeof BUILDER_SECTIONS)[number]['id'];

export const sectionAnchor = (id: BuilderSectionId) => `builder-${id}`;

/** The section a problem belongs to, by the first key of its field ("companions.rows[0]…" → companions). */
export function sectionOf(field: string): BuilderSectionId {
  const head = field.split(/[.[]/, 1)[0];
  return BUILDER_SECTIONS.find((s) => (s.keys as readonly string[]).includes(head))?.id ?? 'run';
}

export function problemCounts(issues: readonly FieldIssue[]): Map<BuilderSectionId, number> {
  const counts = new Map<BuilderSectionId, number>();
  for (const issue of issues) counts.set(sectionOf(issue.field), (counts.get(sectionOf(issue.field)) ?? 0) + 1);
  return counts;
}

export interface BuilderSectionProps {
  id: BuilderSectionId;
  description: ReactNode;
  children: ReactNode;
}

/** One section of the builder: a titled card the side navigation links to. */
export function BuilderSection({ id, description, children }: BuilderSectionProps) {
  const section = BUILDER_SECTIONS.find((s) => s.id === id)!;
  return (
    <div id={sectionAnchor(id)} tabIndex={-1} className="scroll-mt-6 rounded-lg">
      <Card title={section.title} description={description}>
        <div className="flex flex-col gap-6">{children}</div>
      </Card>
    </div>
  );
}

/** Fields side by side where there is room. */
export function FieldGrid({ children, columns = 2 }: { children: ReactNode; columns?: 2 | 3 }) {
  return <div className={columns === 3 ? 'grid items-start gap-5 md:grid-cols-3' : 'grid items-start gap-5 md:grid-cols-2'}>{children}</div>;
}

/** A labelled group of fields inside a section (the core-merger field, the fossil channel). */
export function SubGroup({ title, children, description }: { title: string; description?: ReactNode; children: ReactNode }) {
  return (
    <fieldset className="flex min-w-0 flex-col gap-5 rounded-md border border-ink-700 p-4">
      <legend className="px-2 font-bold text-foam-50">{title}</legend>
      {description && <p className="-mt-2 text-sm text-foam-300">{description}</p>}
      {children}
    </fieldset>
  );
}
