import { useState, type ReactNode } from 'react';
import { formatNumber } from '../../../../shared/contracts/field-issues.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Field, controlClasses } from '../../../components/ui/field.tsx';
import { Select } from '../../../components/ui/select.tsx';
import { NumberField, TextField } from '../../../components/ui/text-field.tsx';
import { cx } from '../../../lib/class-names.ts';
import { parseNumberList, parseNumberText } from '../../../lib/number-input.ts';
import { useBuilder } from './builder-context.tsx';
import { allowedRange, allowedText, getAt, inputId, type DraftPath } from './scenario-draft.ts';
import type { KindChoice } from './scenario-options.ts';
import { optionOf } from '../../../../shared/contracts/method-choices.ts';
import { CitationLinks } from '../../../components/ui/citation-links.tsx';

/** Units that are not appended to an allowed range ("0.01 to 10", not "0.01 to 10 dimensionless"). */
const UNITLESS = new Set(['dimensionless', 'fraction', '×']);

/** "Source: Webbink 1984, ApJ 277, 355", set apart from the hint. */
export function Reference({ children }: { children: ReactNode }) {
  return (
    <span className="mt-0.5 block text-sm text-tide-300">
      <span className="font-bold">Source:</span> {children}
    </span>
  );
}

/** Hint, allowed range and source of a field, in that order. */
function fieldNote(hint: ReactNode, allowed: string | null, unit: string | undefined, reference: ReactNode) {
  if (!hint && !allowed && !reference) return undefined;
  return (
    <>
      {hint && <span>{hint} </span>}
      {allowed && (
        <span>
          Allowed: {allowed}
          {unit && !UNITLESS.has(unit) ? ` ${unit}` : ''}.
        </span>
      )}
      {reference && <Reference>{reference}</Reference>}
    </>
  );
}

const sameNumber = (a: number | null, b: unknown) => (a === null ? b === undefined || b === null : Object.is(a, b));
const defaultFormat = (v: number) => formatNumber(v);

/**
 * The text of a number input, kept as typed ("1e6", "0.50") while it means the value in the
 * document, and replaced when the document changes from elsewhere (a preset, pasted JSON).
 */
function useNumberText(value: unknown, parse: (text: string) => number | null, format: (v: number) => string) {
  const shown = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? format(v) : '');
  const [text, setText] = useState(() => shown(value));
  const [seen, setSeen] = useState(value);
  if (!Object.is(seen, value)) {
    setSeen(value);
    if (!sameNumber(parse(text), value)) setText(shown(value));
  }
  return [text, setText] as const;
}

export interface DraftNumberProps {
  path: DraftPath;
  label: ReactNode;
  unit: string;
  hint?: ReactNode;
  reference?: ReactNode;
  /** Accept "1,000,000" (counts). */
  grouping?: boolean;
  format?: (v: number) => string;
  /** False when a surrounding group states the allowed range once (the two ends of a range). */
  showAllowed?: boolean;
  className?: string;
}

/** A number in the document, with its unit, its allowed range read from the schema, and its problem. */
export function DraftNumber({ path, label, unit, hint, reference, grouping = false, format = defaultFormat, showAllowed = true, className }: DraftNumberProps) {
  const { doc, update, messageAt, readOnly } = useBuilder();
  const parse = (t: string) => parseNumberText(t, { grouping });
  const [text, setText] = useNumberText(getAt(doc, path), parse, format);
  const allowed = showAllowed ? allowedText(allowedRange(doc, path)) : null;
  return (
    <NumberField
      id={inputId(path)}
      label={label}
      unit={unit}
      hint={fieldNote(hint, allowed, unit, reference)}
      error={messageAt(path)}
      value={text}
      readOnly={readOnly}
      className={className}
      onChange={(event) => {
        setText(event.target.value);
        const parsed = parse(event.target.value);
        update(path, parsed === null ? undefined : parsed);
      }}
    />
  );
}

export interface DraftRangeProps {
  path: DraftPath;
  label: string;
  /** Read out after the label but not shown (", row 2" inside a row that already says so). */
  srSuffix?: string;
  unit: string;
  hint?: ReactNode;
  reference?: ReactNode;
}

/** A [low, high] pair: two numbers under one heading, with the pair's own problem (an empty range) below. */
export function DraftRange({ path, label, srSuffix = '', unit, hint, reference }: DraftRangeProps) {
  const { doc, messageAt } = useBuilder();
  const message = messageAt(path);
  const allowed = allowedText(allowedRange(doc, [...path, 0]));
  return (
    <fieldset className="flex min-w-0 flex-col gap-2">
      <legend className="mb-1 font-bold text-foam-50">
        {label}
        {srSuffix && <span className="sr-only">{srSuffix}</span>}
      </legend>
      <p className="-mt-1 text-sm text-foam-400">{fieldNote(hint, allowed ? `each end ${allowed}` : null, unit, reference)}</p>
      <div className="grid gap-3 sm:grid-cols-2">
        {(['from', 'to'] as const).map((end, i) => (
          <DraftNumber
            key={end}
            path={[...path, i]}
            unit={unit}
            showAllowed={false}
            label={
              <>
                <span className="sr-only">
                  {label}
                  {srSuffix},{' '}
                </span>
                {end === 'from' ? 'From' : 'To'}
              </>
            }
          />
        ))}
      </div>
      <p id={`${inputId(path)}-error`} aria-live="polite" className={cx('text-sm font-bold text-coral-300', !message && 'sr-only')}>
        {message}
      </p>
    </fieldset>
  );
}

/** A list of numbers typed as "0.08, 0.5" (IMF breaks and slopes). */
export function DraftNumberList({ path, label, unit, hint, reference }: DraftRangeProps) {
  const { doc, update, messageAt, readOnly } = useBuilder();
  const value = getAt(doc, path);
  const list = Array.isArray(value) ? value : [];
  const [text, setText] = useState(() => list.map((v) => (typeof v === 'number' ? formatNumber(v) : '')).join(', '));
  const [seen, setSeen] = useState(value);
  if (seen !== value) {
    setSeen(value);
    const typed = parseNumberList(text);
    if (typed.length !== list.length || typed.some((t, i) => !Object.is(t, list[i]))) {
      setText(list.map((v) => (typeof v === 'number' ? formatNumber(v) : '')).join(', '));
    }
  }
  // A problem of one entry ("breaksMsun[1] must be …") belongs to the list input too.
  const entryMessage = list.map((_, i) => messageAt([...path, i])).find(Boolean);
  const allowed = allowedText(allowedRange(doc, [...path, 0]));
  return (
    <TextField
      id={inputId(path)}
      label={label}
      unit={unit}
      hint={fieldNote(<>{hint} Separate the values with commas.</>, allowed ? `each ${allowed}` : null, unit, reference)}
      error={messageAt(path) ?? entryMessage}
      value={text}
      readOnly={readOnly}
      autoComplete="off"
      spellCheck={false}
      inputMode="decimal"
      className="tabular-nums"
      onChange={(event) => {
        setText(event.target.value);
        update(path, parseNumberList(event.target.value));
      }}
    />
  );
}

export interface DraftTextProps {
  path: DraftPath;
  label: ReactNode;
  hint?: ReactNode;
  multiline?: boolean;
  maxLength?: number;
  /** Shown after the input (a "New seed" button). */
  addon?: ReactNode;
}

/** A text in the document; an emptied optional text is removed rather than stored as "". */
export function DraftText({ path, label, hint, multiline = false, maxLength, addon }: DraftTextProps) {
  const { doc, update, messageAt, readOnly } = useBuilder();
  const value = getAt(doc, path);
  const text = typeof value === 'string' ? value : '';
  const set = (next: string) => update(path, next === '' ? undefined : next);
  if (multiline) {
    return (
      <Field id={inputId(path)} label={label} hint={hint} error={messageAt(path)}>
        {(control) => (
          <textarea
            {...control}
            rows={3}
            maxLength={maxLength}
            value={text}
            readOnly={readOnly}
            onChange={(event) => set(event.target.value)}
            className={cx(controlClasses, 'resize-y', readOnly && 'bg-ink-850')}
          />
        )}
      </Field>
    );
  }
  return (
    <div className="flex min-w-0 flex-col gap-2">
      <TextField
        id={inputId(path)}
        label={label}
        hint={hint}
        error={messageAt(path)}
        value={text}
        maxLength={maxLength}
        readOnly={readOnly}
        autoComplete="off"
        onChange={(event) => set(event.target.value)}
      />
      {addon}
    </div>
  );
}

export interface DraftKindProps {
  choice: KindChoice;
  label: ReactNode;
  hint?: ReactNode;
}

/**
 * The choice of a union member (IMF law, giant model…): choosing one puts its template in the
 * document, so its own fields appear with values that are valid. The chosen option's summary
 * and source are shown under it.
 */
export function DraftKind({ choice, label, hint }: DraftKindProps) {
  const { doc, update, messageAt, readOnly } = useBuilder();
  const current = getAt(doc, [...choice.path, choice.discriminator]);
  const option = optionOf(choice, current);
  return (
    <div className="flex min-w-0 flex-col gap-1.5">
      <Select
        id={inputId([...choice.path, choice.discriminator])}
        label={label}
        hint={hint}
        error={messageAt([...choice.path, choice.discriminator]) ?? messageAt(choice.path)}
        value={option ? option.value : ''}
        disabled={readOnly}
        options={[...(option ? [] : [{ value: '', label: 'Choose…', disabled: true }]), ...choice.options.map((o) => ({ value: o.value, label: o.label }))]}
        onChange={(event) => {
          const next = optionOf(choice, event.target.value);
          if (next) update(choice.path, structuredClone(next.template));
        }}
      />
      {option && (
        <p className="text-sm text-foam-300">
          {option.summary}
          {option.cites.length > 0 && (
            <Reference>
              <CitationLinks cites={option.cites} />
            </Reference>
          )}
        </p>
      )}
    </div>
  );
}

export interface DraftSelectProps {
  path: DraftPath;
  label: ReactNode;
  options: readonly { value: string; label: string }[];
  hint?: ReactNode;
}

/** One of a fixed list of words (an IFMR calibration, a companion class). */
export function DraftSelect({ path, label, options, hint }: DraftSelectProps) {
  const { doc, update, messageAt, readOnly } = useBuilder();
  const value = getAt(doc, path);
  return (
    <Select
      id={inputId(path)}
      label={label}
      hint={hint}
      error={messageAt(path)}
      value={typeof value === 'string' ? value : ''}
      disabled={readOnly}
      options={options}
      onChange={(event) => update(path, event.target.value)}
    />
  );
}

export interface CheckboxFieldProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  checked: boolean;
  disabled?: boolean;
  onChange: (checked: boolean) => void;
}

/** A labelled checkbox with an optional hint beside it. */
export function CheckboxField({ id, label, hint, checked, disabled, onChange }: CheckboxFieldProps) {
  return (
    <div className="flex items-start gap-3">
      <input
        id={id}
        type="checkbox"
        checked={checked}
        disabled={disabled}
        aria-describedby={hint ? `${id}-hint` : undefined}
        onChange={(event) => onChange(event.target.checked)}
        className="mt-1 size-5 shrink-0 cursor-pointer accent-lantern-400 disabled:cursor-not-allowed"
      />
      <div className="min-w-0">
        <label htmlFor={id} className="cursor-pointer font-bold text-foam-50">
          {label}
        </label>
        {hint && (
          <p id={`${id}-hint`} className="text-sm text-foam-400">
            {hint}
          </p>
        )}
      </div>
    </div>
  );
}

/** A yes/no in the document (a channel on or off). */
export function DraftCheckbox({ path, label, hint }: { path: DraftPath; label: ReactNode; hint?: ReactNode }) {
  const { doc, update, readOnly } = useBuilder();
  return <CheckboxField id={inputId(path)} label={label} hint={hint} checked={getAt(doc, path) === true} disabled={readOnly} onChange={(checked) => update(path, checked)} />;
}

export interface PointColumn {
  key: string;
  label: string;
  unit: string;
}

export interface DraftPointsProps {
  path: DraftPath;
  label: string;
  hint?: ReactNode;
  columns: readonly [PointColumn, PointColumn];
  /** The point a new row starts with. */
  newPoint: (last: Record<string, unknown> | undefined) => Record<string, unknown>;
}

/** Both point tables of the schema (lifetimes, IFMR) hold 2 to 200 points. */
const MIN_POINTS = 2;
const MAX_POINTS = 200;

/** A user table of (x, y) points (a lifetime relation, an IFMR): one row of two numbers per point. */
export function DraftPoints({ path, label, hint, columns, newPoint }: DraftPointsProps) {
  const min = MIN_POINTS;
  const max = MAX_POINTS;
  const { doc, update, messageAt, readOnly } = useBuilder();
  const value = getAt(doc, path);
  const points = (Array.isArray(value) ? value : []) as Record<string, unknown>[];
  const message = messageAt(path);
  return (
    <fieldset className="flex min-w-0 flex-col gap-3">
      <legend className="mb-1 font-bold text-foam-50">{label}</legend>
      {hint && <p className="-mt-1 text-sm text-foam-400">{hint}</p>}
      <ol className="flex flex-col gap-3">
        {points.map((_, i) => (
          <li key={i} className="grid items-end gap-3 rounded-md border border-ink-700 p-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto]">
            {columns.map((column) => (
              <DraftNumber
                key={column.key}
                path={[...path, i, column.key]}
                unit={column.unit}
                label={
                  <>
                    {column.label}
                    <span className="sr-only">, point {i + 1}</span>
                  </>
                }
              />
            ))}
            {!readOnly && (
              <Button variant="ghost" size="sm" className="text-coral-300" disabled={points.length <= min} onClick={() => update(path, points.filter((__, j) => j !== i))}>
                Remove<span className="sr-only"> point {i + 1}</span>
              </Button>
            )}
          </li>
        ))}
      </ol>
      <p aria-live="polite" className={cx('text-sm font-bold text-coral-300', !message && 'sr-only')}>
        {message}
      </p>
      {!readOnly && (
        <div>
          <Button variant="secondary" size="sm" disabled={points.length >= max} onClick={() => update(path, [...points, newPoint(points.at(-1))])}>
            Add a point
          </Button>
        </div>
      )}
    </fieldset>
  );
}
