import { useCallback, useEffect, useMemo, useRef, useState, type FormEvent, type ReactNode } from 'react';
import { nameSchema } from '../../../../shared/contracts/common.ts';
import { listPriceCredits } from '../../../../shared/contracts/pricing.ts';
import type { FieldIssue } from '../../../../shared/contracts/field-issues.ts';
import { Alert } from '../../../components/ui/alert.tsx';
import { Badge } from '../../../components/ui/badge.tsx';
import { Button } from '../../../components/ui/button.tsx';
import { errorMessage } from '../../../components/ui/error-state.tsx';
import { Field, controlClasses } from '../../../components/ui/field.tsx';
import { TextField } from '../../../components/ui/text-field.tsx';
import { useUnsavedChanges } from '../../../hooks/use-unsaved-changes.tsx';
import { cx } from '../../../lib/class-names.ts';
import { BuilderContext, useBuilder, type BuilderContextValue } from './builder-context.tsx';
import { mergeIssues, rangeOrderIssues, serverIssuesOf } from './draft-checks.ts';
import { problemSentence } from './field-labels.ts';
import { DraftNumber, DraftText } from './builder-fields.tsx';
import { BUILDER_SECTIONS, BuilderSection, FieldGrid, problemCounts, sectionAnchor, type BuilderSectionId } from './builder-section.tsx';
import { CompanionsSection } from './companions-section.tsx';
import { ChannelsSection, DisruptionSection, EnvelopeSection, FieldSection, GiantSection, PrimariesSection, SelectionSection } from './physics-sections.tsx';
import {
  atFieldMessage,
  draftIssues,
  fieldKey,
  inputId,
  messagesByField,
  newSeed,
  runSystems,
  sameDocument,
  setAt,
  withDefaults,
  type Draft,
  type DraftPath,
} from './scenario-draft.ts';
import { ScenarioJsonView } from './scenario-json-view.tsx';

export interface ScenarioSaveInput {
  name: string;
  note?: string;
  document: Draft;
  /** False when only the name changed (the document need not be sent). */
  documentChanged: boolean;
  nameChanged: boolean;
}

export interface ScenarioBuilderProps {
  departmentId: string;
  /** Observers: every value shown, nothing can be changed or saved. */
  readOnly: boolean;
  /** What is stored (or, for a new scenario, what the page started from): changes are counted against it. */
  baseline: { name: string; doc: Draft };
  /** A draft to start from other than the baseline (an older version opened for editing). */
  start?: Draft;
  /** A new scenario can be saved even unchanged. */
  isNew: boolean;
  /** Shown under the name field (where a new scenario started from). */
  nameNote?: ReactNode;
  saveLabel: string;
  /**
   * Stores the scenario; resolves to the words that confirm it ("Saved as version 3.") and,
   * optionally, where to go next (called once leaving is allowed); rejects with the server's ApiError.
   */
  onSave: (input: ScenarioSaveInput) => Promise<{ message: string; next?: () => void }>;
  /** Shows what a run of `systems` costs (the route composes the department's quote). */
  renderCost?: (systems: number | null) => ReactNode;
  /** Shown above the builder (which version is open). */
  banner?: ReactNode;
}

type View = 'form' | 'json';
const NAME_ID = 'scenario-name';
const NOTE_ID = 'scenario-note';
/** Marks a pending focus on a whole section (from the section list) rather than on a field. */
const SECTION_PREFIX = 'section:';
const SAVE_REASON_ID = 'scenario-save-reason';

/**
 * The document without its inner `title`: the scenario's name is its one name (a preset's
 * title would otherwise travel on silently inside a document saved under another name).
 */
function withoutTitle(doc: Draft): Draft {
  if (!('title' in doc)) return doc;
  const { title: _title, ...rest } = doc;
  return rest;
}

/** Where a field's input is, or the first input inside it (a range, a row). */
function findInput(root: HTMLElement | null, field: string): HTMLElement | null {
  if (!root) return null;
  const id = field === 'name' || field === 'note' ? (field === 'name' ? NAME_ID : NOTE_ID) : inputId(field);
  const exact = document.getElementById(id);
  if (exact && root.contains(exact)) return exact;
  return root.querySelector<HTMLElement>(['input', 'select', 'textarea'].map((tag) => `${tag}[id^="${id}-"]`).join(', '));
}

/**
 * The scenario builder: the document in sections (run, primaries, companions, giant phase,
 * common envelope, disruption, field, channels, selection) or as raw JSON, checked as you type
 * with the shared schema, every problem shown at its input with the allowed range. On save the
 * server's answer is shown at the field it names (`document.<path>` → that input).
 */
export function ScenarioBuilder({ departmentId, readOnly, baseline: initialBaseline, start, isNew, nameNote, saveLabel, onSave, renderCost, banner }: ScenarioBuilderProps) {
  const formRef = useRef<HTMLFormElement>(null);
  const [baseline, setBaseline] = useState(() => ({ name: initialBaseline.name, doc: withoutTitle(initialBaseline.doc) }));
  const [doc, setDoc] = useState<Draft>(() => withoutTitle(start ?? initialBaseline.doc));
  const [name, setName] = useState(initialBaseline.name);
  const [note, setNote] = useState('');
  const [view, setView] = useState<View>('form');
  const [jsonKey, setJsonKey] = useState(0);
  // What the server said of the last save, each at its field; cleared by the next edit.
  const [serverIssues, setServerIssues] = useState<FieldIssue[]>([]);
  // The JSON tab's text when it cannot be read (the document is then the last readable one).
  const [jsonError, setJsonError] = useState<string | null>(null);
  const [formFieldErrors, setFormFieldErrors] = useState<{ name?: string; note?: string }>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  const [pendingFocus, setPendingFocus] = useState<string | null>(null);
  // An empty name is only pointed out once the user has typed in it or tried to save.
  const [nameTouched, setNameTouched] = useState(false);

  // Every problem at once: the schema's, and the range-order checks it makes only once everything else is valid.
  const issues = useMemo(() => mergeIssues(draftIssues(doc), rangeOrderIssues(doc, fieldKey)), [doc]);
  const messages = useMemo(() => messagesByField(issues), [issues]);
  const nameCheck = nameSchema.safeParse(name.trim());
  const nameEmpty = name.trim() === '';
  const nameProblem = nameCheck.success ? null : nameEmpty ? 'Give the scenario a name.' : atFieldMessage('name', nameCheck.error.issues[0]?.message ?? 'name is not allowed');
  const nameServerIssue = serverIssues.find((i) => i.field === 'name');
  const nameError = formFieldErrors.name ?? (nameServerIssue ? atFieldMessage('name', nameServerIssue.message) : nameProblem && nameTouched ? nameProblem : undefined);
  const changed = !sameDocument(doc, baseline.doc) || name !== baseline.name || jsonError !== null;

  // The server's problems first (it decides), then the live ones at other fields; the name's own problem is one of them.
  const shownIssues = useMemo(() => {
    const fromServer = serverIssues.filter((i) => i.field !== 'name' && i.field !== 'note');
    const serverFields = new Set(fromServer.map((i) => i.field));
    const live = issues.filter((i) => !serverFields.has(i.field));
    const nameIssue: FieldIssue[] = nameServerIssue ? [nameServerIssue] : nameProblem ? [{ field: 'name', message: nameEmpty ? 'needs a name' : nameProblem }] : [];
    return [...nameIssue, ...fromServer, ...live];
  }, [issues, serverIssues, nameServerIssue, nameProblem, nameEmpty]);
  const counts = problemCounts(shownIssues.filter((i) => i.field !== 'name'));
  const problemTotal = shownIssues.length + (jsonError ? 1 : 0);

  const update = useCallback((path: DraftPath, value: unknown) => {
    setDoc((current) => setAt(current, path, value));
    setServerIssues([]);
    setSaved(null);
  }, []);

  const context = useMemo<BuilderContextValue>(
    () => ({
      doc,
      update,
      readOnly,
      departmentId,
      messageAt: (path) => {
        const key = fieldKey(path);
        const fromServer = serverIssues.find((i) => i.field === key);
        if (fromServer) return atFieldMessage(key, fromServer.message);
        return messages.get(key);
      },
    }),
    [doc, update, readOnly, departmentId, messages, serverIssues],
  );

  // Focus moves after the render that shows the field (and its message).
  useEffect(() => {
    if (pendingFocus === null) return;
    setPendingFocus(null);
    const section = pendingFocus.startsWith(SECTION_PREFIX) ? (pendingFocus.slice(SECTION_PREFIX.length) as BuilderSectionId) : null;
    const target = section ? document.getElementById(sectionAnchor(section)) : findInput(formRef.current, pendingFocus);
    if (target) {
      target.scrollIntoView({ block: 'center' });
      target.focus({ preventScroll: true });
    }
  }, [pendingFocus]);

  const guard = useUnsavedChanges(changed && !readOnly, 'The scenario', { search: isNew });

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (readOnly || saving) return;
    setNameTouched(true);
    // Known problems are listed under Check; Save stays disabled until they are fixed (Enter in a field lands here too).
    if (problemTotal > 0) return;
    setSaving(true);
    setFormError(null);
    setFormFieldErrors({});
    setServerIssues([]);
    setSaved(null);
    try {
      const trimmedNote = note.trim();
      const { message, next } = await onSave({
        name: name.trim(),
        ...(trimmedNote ? { note: trimmedNote } : {}),
        document: doc,
        documentChanged: !sameDocument(doc, baseline.doc),
        nameChanged: name !== baseline.name,
      });
      setBaseline({ name: name.trim(), doc });
      setName(name.trim());
      setNote('');
      setSaved(message);
      if (next) {
        guard.release();
        next();
      }
    } catch (error) {
      // Every problem the server listed goes to its field; the first one gets the focus.
      const listed = serverIssuesOf(error);
      const count = listed.length;
      setFormError(count > 1 ? `Not saved: the server found ${count} problems, listed under Check and shown at their fields.` : `Not saved. ${errorMessage(error)}`);
      const note = listed.find((i) => i.field === 'note');
      if (note) setFormFieldErrors({ note: atFieldMessage('note', note.message) });
      setServerIssues(listed);
      if (listed.length > 0) goTo(listed[0].field);
    } finally {
      setSaving(false);
    }
  }

  function discard() {
    setDoc(baseline.doc);
    setName(baseline.name);
    setNote('');
    setServerIssues([]);
    setJsonError(null);
    setFormError(null);
    setFormFieldErrors({});
    setJsonKey((k) => k + 1);
  }

  function switchView(next: View) {
    // Back from pasted JSON: show a value in every field the document leaves to its defaults.
    if (view === 'json' && next === 'form' && !readOnly) setDoc((current) => withDefaults(current));
    // Text that could not be read is left behind with the JSON tab; the form shows the last readable document.
    if (next === 'form') setJsonError(null);
    setView(next);
  }

  function goTo(field: string) {
    switchView('form');
    setPendingFocus(field);
  }

  const systems = runSystems(doc);

  return (
    <BuilderContext.Provider value={context}>
      <form ref={formRef} onSubmit={submit} noValidate aria-label={isNew ? 'New scenario' : `Edit ${baseline.name}`} className="flex flex-col gap-6">
        {banner}
        {readOnly && <Alert tone="info" message="Read-only: your role can read scenarios and run them, but not change them; a modeller or an admin can." />}
        <div className="flex flex-col gap-4 rounded-lg border border-ink-700 bg-ink-850 p-5 sm:p-6">
          <div className="grid items-end gap-4 md:grid-cols-[minmax(0,1fr)_auto]">
            <TextField
              id={NAME_ID}
              label="Scenario name"
              hint={
                <>
                  The scenario’s one name: in lists, on runs and in the methods paragraph. Up to 160 characters.
                  {nameNote && <span className="mt-1 block">{nameNote}</span>}
                </>
              }
              value={name}
              maxLength={160}
              readOnly={readOnly}
              autoComplete="off"
              error={nameError}
              onChange={(event) => {
                setName(event.target.value);
                setNameTouched(true);
                setFormFieldErrors((e) => ({ ...e, name: undefined }));
                setServerIssues((list) => list.filter((i) => i.field !== 'name'));
                setSaved(null);
              }}
            />
            <ViewSwitch view={view} onChange={switchView} />
          </div>
          <nav aria-label="Sections of the scenario">
            <ul className="flex flex-wrap gap-2">
              {BUILDER_SECTIONS.map((section) => {
                const count = counts.get(section.id) ?? 0;
                return (
                  <li key={section.id}>
                    <button
                      type="button"
                      onClick={() => goTo(`${SECTION_PREFIX}${section.id}`)}
                      className={cx(
                        'inline-flex min-h-9 items-center gap-2 rounded-full border px-3 text-sm font-bold',
                        count > 0 ? 'border-coral-300/70 text-coral-300 hover:bg-coral-300/10' : 'border-ink-600 text-foam-50 hover:bg-ink-800',
                      )}
                    >
                      {section.title}
                      {count > 0 && (
                        <span>
                          {count}
                          <span className="sr-only"> problem{count === 1 ? '' : 's'}</span>
                        </span>
                      )}
                    </button>
                  </li>
                );
              })}
            </ul>
          </nav>
        </div>

        {view === 'form' ? (
          <>
            <RunSection renderCost={renderCost} systems={systems} />
            <PrimariesSection />
            <CompanionsSection />
            <GiantSection />
            <EnvelopeSection />
            <DisruptionSection />
            <FieldSection />
            <ChannelsSection />
            <SelectionSection />
          </>
        ) : (
          <div className="rounded-lg border border-ink-700 bg-ink-850 p-5 sm:p-6">
            <ScenarioJsonView
              key={jsonKey}
              doc={doc}
              readOnly={readOnly}
              fileName={name}
              onChange={(next) => update([], withoutTitle(next))}
              onUnreadable={(message) => {
                setJsonError(message);
                setSaved(null);
              }}
            />
          </div>
        )}

        <section aria-labelledby="scenario-check-title" className="grid items-start gap-6 rounded-lg border border-ink-700 bg-ink-850 p-5 sm:p-6 md:grid-cols-2">
          <div className="min-w-0">
            <h2 id="scenario-check-title" className="text-xl font-bold text-foam-50">
              {jsonError ? 'Check: the JSON cannot be read' : shownIssues.length === 0 ? 'Check: no problems' : `Check: ${shownIssues.length} problem${shownIssues.length === 1 ? '' : 's'}`}
            </h2>
            {jsonError ? (
              <p className="mt-1 text-foam-300">The text in the JSON tab is not a readable document, so nothing in it can be checked yet. Its error is shown under the text; once it reads, every value is checked here.</p>
            ) : (
              <ProblemList issues={shownIssues} onGoTo={goTo} />
            )}
          </div>
          {!readOnly && (
            <Field id={NOTE_ID} label="Note for this version" hint="Optional: what changed and why. Kept in the version history." error={formFieldErrors.note}>
              {(control) => (
                <textarea {...control} rows={2} maxLength={2000} value={note} onChange={(event) => setNote(event.target.value)} className={cx(controlClasses, 'resize-y')} />
              )}
            </Field>
          )}
        </section>

        {!readOnly && (
          // Stays in view while there is something to save.
          <div
            className={cx(
              '-mx-4 flex flex-col gap-3 border-t border-ink-600 bg-ink-900/95 px-4 py-3 sm:-mx-8 sm:px-8',
              (changed || isNew || formError) && 'sticky bottom-0 z-10 backdrop-blur',
            )}
          >
            <Alert message={formError ?? undefined} />
            <div className="flex flex-wrap items-center gap-3">
              <Button type="submit" pending={saving} disabled={(!isNew && !changed) || problemTotal > 0} aria-describedby={problemTotal > 0 ? SAVE_REASON_ID : undefined}>
                {saveLabel}
              </Button>
              {changed && !isNew && (
                <Button variant="ghost" onClick={discard}>
                  Discard changes
                </Button>
              )}
              <span aria-live="polite" className="text-sm text-foam-300">
                {saved ? <span className="font-bold text-kelp-300">{saved}</span> : changed ? <Badge tone="warning">Unsaved changes</Badge> : isNew ? 'Not saved yet.' : 'No unsaved changes.'}
              </span>
              {problemTotal > 0 && (
                <p id={SAVE_REASON_ID} className="text-sm text-foam-300">
                  {jsonError
                    ? 'Saving waits until the JSON text can be read.'
                    : `Saving waits until ${shownIssues.length === 1 ? 'the problem under Check is' : `the ${shownIssues.length} problems under Check are`} fixed.`}
                </p>
              )}
              {!jsonError && shownIssues.length > 0 && (
                <button type="button" onClick={() => goTo(shownIssues[0].field)} className="ml-auto text-sm font-bold text-coral-300 underline underline-offset-3">
                  {shownIssues.length} problem{shownIssues.length === 1 ? '' : 's'}: go to the first
                </button>
              )}
            </div>
          </div>
        )}
      </form>
      {guard.dialog}
    </BuilderContext.Provider>
  );
}

function ViewSwitch({ view, onChange }: { view: View; onChange: (view: View) => void }) {
  return (
    <div role="group" aria-label="Show the scenario as" className="inline-flex rounded-md border border-ink-500 p-0.5">
      {(
        [
          ['form', 'Form'],
          ['json', 'JSON'],
        ] as const
      ).map(([value, label]) => (
        <button
          key={value}
          type="button"
          aria-pressed={view === value}
          onClick={() => onChange(value)}
          className={cx('min-h-10 rounded px-4 font-bold', view === value ? 'bg-foam-50 text-ink-950' : 'text-foam-50 hover:bg-ink-800')}
        >
          {label}
        </button>
      ))}
    </div>
  );
}

function RunSection({ renderCost, systems }: { renderCost?: (systems: number | null) => ReactNode; systems: number | null }) {
  const { update, readOnly } = useBuilder();
  return (
    <BuilderSection id="run" description="The scenario’s description, its seed and how many primaries a run draws.">
      <FieldGrid>
        <DraftText
          path={['seed']}
          label="Seed"
          hint="The same seed and document give the same result, on any number of workers."
          maxLength={200}
          addon={
            !readOnly && (
              <div>
                <Button variant="secondary" size="sm" onClick={() => update(['seed'], newSeed())}>
                  New seed
                </Button>
              </div>
            )
          }
        />
      </FieldGrid>
      <DraftText path={['description']} label="Description" hint="Optional: what the scenario tests. Up to 4000 characters." multiline maxLength={4000} />
      <div className="grid items-start gap-5 md:grid-cols-2">
        <DraftNumber
          path={['systems']}
          label="Systems per run"
          unit="systems"
          grouping
          format={(v) => v.toLocaleString('en-US')}
          hint="Primaries drawn; “1e7” and “10^7” work too. The Monte Carlo error shrinks as 1/√N."
        />
        <div className="flex flex-col gap-2" aria-live="polite">
          <p className="font-bold text-foam-50">Cost of one run</p>
          {systems === null ? (
            <p className="text-foam-300">The cost appears once the number of systems is valid.</p>
          ) : (
            <>
              {renderCost?.(systems)}
              <p className="text-sm text-foam-400">
                List price with no free systems left: {listPriceCredits(systems).toLocaleString('en-US')} credit{listPriceCredits(systems) === 1 ? '' : 's'} (one per 10^7 systems, rounded up).
              </p>
            </>
          )}
        </div>
      </div>
    </BuilderSection>
  );
}

function ProblemList({ issues, onGoTo }: { issues: readonly FieldIssue[]; onGoTo: (field: string) => void }) {
  const SHOWN = 12;
  return (
    <div aria-live="polite">
      {issues.length === 0 ? (
        <p className="mt-1 text-kelp-300">Every value is inside its allowed range and the document is complete.</p>
      ) : (
        <ul className="mt-2 flex flex-col gap-2">
          {issues.slice(0, SHOWN).map((issue) => (
            <li key={`${issue.field}:${issue.message}`}>
              <button type="button" onClick={() => onGoTo(issue.field)} className="text-left text-coral-300 underline decoration-1 underline-offset-3 hover:decoration-2 [overflow-wrap:anywhere]">
                {problemSentence(issue.field, issue.message)}
              </button>
            </li>
          ))}
          {issues.length > SHOWN && <li className="text-foam-400">and {issues.length - SHOWN} more.</li>}
        </ul>
      )}
    </div>
  );
}
