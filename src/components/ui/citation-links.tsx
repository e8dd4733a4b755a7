import { Fragment } from 'react';
import { citationOf, doiUrl, type Citation, type Cite } from '../../../shared/contracts/citations.ts';
import { doiOf } from '../../../shared/contracts/method-choices.ts';

const linkClass = 'underline decoration-dotted underline-offset-2 hover:text-foam-50';

/** One citation: a plain link to its DOI (https://doi.org/…, never fetched by the app), or plain text without one. */
function CitationLink({ citation, text }: { citation: Citation | undefined; text: string }) {
  const doi = citation?.doi;
  return doi ? (
    <a className={linkClass} href={doiUrl(doi)} target="_blank" rel="noopener noreferrer">
      {text}
    </a>
  ) : (
    <>{text}</>
  );
}

/** Short citations by key or inline ("Kroupa 2001; Press et al. 1992"), each linked to its DOI when it has one. */
export function CitationLinks({ cites, full = false }: { cites: readonly Cite[]; full?: boolean }) {
  return (
    <>
      {cites.map(citationOf).map((citation, i) => (
        <Fragment key={citation.short}>
          {i > 0 && '; '}
          <CitationLink citation={citation} text={full ? citation.full : citation.short} />
        </Fragment>
      ))}
    </>
  );
}

/** A stored free-text reference list ("A, B. 2001, …; C, D. 1990, …"), each part linked to its DOI when it has one. */
export function ReferenceLinks({ text }: { text: string }) {
  const parts = text.split('; ');
  return (
    <>
      {parts.map((part, i) => {
        const doi = doiOf(part);
        return (
          <Fragment key={i}>
            {i > 0 && '; '}
            <CitationLink citation={doi ? { short: part, full: part, doi } : undefined} text={part} />
          </Fragment>
        );
      })}
    </>
  );
}
