import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { controlClasses } from '../../../components/ui/field.tsx';
import { cx } from '../../../lib/class-names.ts';
import { draftJson, parseDraftJson, type Draft } from './scenario-draft.ts';

export interface ScenarioJsonViewProps {
  doc: Draft;
  /** Called with the pasted document as soon as the text is a JSON object. */
  onChange: (doc: Draft) => void;
  /** Why the text cannot be read as a document, or null once it can. */
  onUnreadable?: (message: string | null) => void;
  readOnly: boolean;
  /** The file name of a download, without ".json". */
  fileName: string;
}

/** Offers text as a file download. */
function download(text: string, fileName: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'application/json' }));
  const link = document.createElement('a');
  link.href = url;
  link.download = `${fileName.replace(/[^A-Za-z0-9._-]+/g, '_') || 'scenario'}.json`;
  link.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/**
 * The scenario document as JSON, for power users: read it, copy it to the command line or the
 * REST API, or paste one. Pasted text takes effect as soon as it is a JSON object; the
 * problems list beside the builder then says what the schema thinks of it.
 */
export function ScenarioJsonView({ doc, onChange, onUnreadable, readOnly, fileName }: ScenarioJsonViewProps) {
  const id = useId();
  const [text, setText] = useState(() => draftJson(doc));
  const [parseError, setParseError] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      <label htmlFor={id} className="font-bold text-foam-50">
        Scenario document (JSON)
      </label>
      <p id={`${id}-hint`} className="text-sm text-foam-400">
        The same document the REST API and the command line take. {readOnly ? 'Read-only for your role.' : 'Paste or edit it here; the form follows as soon as the text is valid JSON.'}
      </p>
      <textarea
        id={id}
        value={text}
        readOnly={readOnly}
        spellCheck={false}
        aria-describedby={`${id}-hint ${id}-error`}
        aria-invalid={parseError ? true : undefined}
        rows={28}
        onChange={(event) => {
          setText(event.target.value);
          const parsed = parseDraftJson(event.target.value);
          setParseError(parsed.ok ? null : parsed.message);
          onUnreadable?.(parsed.ok ? null : parsed.message);
          if (parsed.ok) onChange(parsed.doc);
        }}
        className={cx(controlClasses, 'min-h-96 resize-y font-mono text-sm leading-relaxed', readOnly && 'bg-ink-850')}
      />
      <p id={`${id}-error`} aria-live="polite" className={cx('text-sm font-bold text-coral-300', !parseError && 'sr-only')}>
        {parseError}
      </p>
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" size="sm" onClick={() => download(text, fileName)}>
          Download the JSON
        </Button>
        {!readOnly && (
          <Button variant="ghost" size="sm" disabled={Boolean(parseError)} onClick={() => setText(draftJson(doc))}>
            Tidy the text
          </Button>
        )}
      </div>
    </div>
  );
}
