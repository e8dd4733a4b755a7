import {
  CONSTRAINT_KINDS,
  LIBRARY_SET_ID,
  constraintSchemaFor,
  type Constraint,
  type ConstraintSet,
  type ConstraintSetBody,
  type ConstraintSetSummary,
  type Evaluation,
  type ObservedConstraint,
  type TwoSampleBody,
  type TwoSampleResponse,
} from '../../../shared/contracts/constraints.ts';
import { fieldIssues, projectWords } from '../../../shared/contracts/field-issues.ts';
import { clopperPearson } from '../../../shared/engine/stats/clopper-pearson.ts';
import { formatPercent, formatPValue, formatSigma } from '../../../shared/engine/stats/format.ts';
import { sameFractionTest } from '../../../shared/engine/stats/two-sample.ts';
import type { Db } from '../../db/client.ts';
import { newId } from '../../db/columns.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import { parseConstraintCsv } from './constraint-csv.ts';
import {
  findConstraintSet,
  insertConstraintSet,
  insertConstraintSetVersion,
  listConstraintSets,
  listConstraintSetVersions,
  lockConstraintSet,
  updateConstraintSetRow,
  type ConstraintSetRow,
  type ConstraintSetVersionRow,
} from './constraint-sets.repository.ts';
import { ConstraintCsvError, constraintSetNotFound, invalidConstraint } from './constraints.errors.ts';
import { evaluateConstraints, type EvaluableResult, type ResolvedConstraint } from './evaluate.ts';
import { CONSTRAINT_LIBRARY, libraryConstraint } from './library.ts';

const LIST_FIELD = { meanMass: 'massesMsun', fieldDistribution: 'fieldsMG', postCommonEnvelopePeriods: 'periodsDays' } as const;

/**
 * Checks every constraint on its own (a library reference or one of the kinds) so that an error
 * names `constraints.<i>.<field>`; a `csv` text becomes the constraint's list (or cooling-age bins)
 * and is not kept. Throws before anything is stored.
 */
export function checkConstraints(raw: Record<string, unknown>[]): Constraint[] {
  return raw.map((input, i) => {
    let candidate: Record<string, unknown> = input;
    if (typeof input.csv === 'string' && typeof input.kind === 'string' && input.kind !== 'fraction') {
      const kind = input.kind as keyof typeof LIST_FIELD | 'coolingAgeIncidence';
      if (kind in LIST_FIELD || kind === 'coolingAgeIncidence') {
        const parsed = parseConstraintCsv(kind, input.csv);
        if (parsed.problems.length > 0) throw new ConstraintCsvError(i, parsed.problems);
        const { csv: _csv, ...rest } = input;
        candidate = kind === 'coolingAgeIncidence' ? { ...rest, bins: parsed.bins } : { ...rest, [LIST_FIELD[kind]]: parsed.values };
      }
    }
    const schema = constraintSchemaFor(candidate);
    const result = schema.safeParse(candidate, { error: projectWords });
    if (!result.success) {
      const first = result.error.issues[0];
      const path = first.path.map(String).join('.');
      const described = fieldIssues([first])[0];
      const text = first.code === 'custom' ? first.message : described.message;
      const field = `constraints.${i}${path ? `.${path}` : ''}`;
      const named = [path, described.field].find((f) => f && text.startsWith(f));
      const message = named ? `constraints[${i}].${text}` : `constraints[${i}]${path ? `.${path}` : ''}: ${text}`;
      throw invalidConstraint({ field, message });
    }
    const parsed = result.data as Constraint;
    if ('libraryId' in parsed && !libraryConstraint(parsed.libraryId)) {
      throw invalidConstraint({ field: `constraints.${i}.libraryId`, message: `constraints[${i}].libraryId names no library constraint (got "${parsed.libraryId}"; GET /api/constraint-library lists them)` });
    }
    if ('csv' in parsed) delete (parsed as { csv?: string }).csv;
    return parsed;
  });
}

/** Library references replaced by the library's constraint; ids are the library's or "c<n>" by position. */
export function resolveConstraints(constraints: Constraint[]): ResolvedConstraint[] {
  return constraints.map((c, i) => {
    if ('libraryId' in c) {
      const entry = libraryConstraint(c.libraryId)!;
      return { id: entry.id, constraint: entry.constraint, citation: entry.citation, name: entry.name };
    }
    return { id: `c${i + 1}`, constraint: c, citation: c.citation ?? null };
  });
}

const kindsOf = (constraints: Constraint[]) => {
  const kinds = new Set(resolveConstraints(constraints).map((r) => r.constraint.kind));
  return CONSTRAINT_KINDS.filter((k) => kinds.has(k));
};

function summary(row: { set: ConstraintSetRow; version: ConstraintSetVersionRow }): ConstraintSetSummary {
  const constraints = row.version.constraints as Constraint[];
  return {
    id: row.set.id,
    name: row.set.name,
    currentVersion: row.set.currentVersion,
    constraintCount: constraints.length,
    kinds: kindsOf(constraints),
    library: false,
    updatedAt: row.set.updatedAt.toISOString(),
  };
}

const LIBRARY_NAME = 'Published constraints (library)';
const libraryConstraints = (): Constraint[] => CONSTRAINT_LIBRARY.map((e) => ({ libraryId: e.id }));

/** The whole library as a set every department sees. */
function librarySet(): ConstraintSet {
  const constraints = libraryConstraints();
  return { id: LIBRARY_SET_ID, name: LIBRARY_NAME, currentVersion: 1, constraintCount: constraints.length, kinds: kindsOf(constraints), library: true, updatedAt: new Date(0).toISOString(), constraints, note: 'Read-only: every entry as its paper states it, with its citation.', versions: [] };
}

function interval(k: number, n: number, confidence: number): [number, number] {
  const ci = clopperPearson(k, n, confidence);
  return [ci.lower, ci.upper];
}

/** Two observed samples: can they share one magnetic fraction? Fisher's exact test and both Clopper–Pearson intervals. */
export function twoSample(body: TwoSampleBody): TwoSampleResponse {
  const test = sameFractionTest(body.a.magnetic, body.a.total, body.b.magnetic, body.b.total);
  const side = (s: { magnetic: number; total: number }) => ({ ...s, fraction: s.magnetic / s.total, interval68: interval(s.magnetic, s.total, 0.6827), interval95: interval(s.magnetic, s.total, 0.95) });
  const a = side(body.a);
  const b = side(body.b);
  const words = test.sigma < 2 ? 'can share one magnetic fraction' : test.sigma < 3 ? 'are in mild tension with one shared fraction' : test.sigma < 5 ? 'are in strong tension with one shared fraction' : 'cannot share one magnetic fraction';
  return {
    a,
    b,
    p: test.pValue,
    sigma: Number.isFinite(test.sigma) ? test.sigma : null,
    verdict:
      `The two samples (${a.magnetic} of ${a.total}, ${formatPercent(a.fraction)}; ${b.magnetic} of ${b.total}, ${formatPercent(b.fraction)}) ${words} ` +
      `(Fisher's exact test: p = ${formatPValue(Math.log(test.pValue))}, ${formatSigma(test.sigma)}).`,
    method: test.method,
    intervalMethod: 'Clopper & Pearson (1934, Biometrika 26, 404) exact intervals of each observed fraction, 68.27% and 95%',
  };
}

export function createConstraintSetsService(db: Db) {
  async function detail(departmentId: string, id: string): Promise<ConstraintSet> {
    if (id === LIBRARY_SET_ID) return librarySet();
    const row = await findConstraintSet(db, departmentId, id);
    if (!row) throw constraintSetNotFound();
    const versions = await listConstraintSetVersions(db, id);
    return {
      ...summary(row),
      constraints: row.version.constraints as Constraint[],
      note: row.version.note,
      versions: versions.map((v) => ({ version: v.version, createdAt: v.createdAt.toISOString(), createdByUserId: v.createdByUserId })),
    };
  }

  return {
    detail: (auth: RequestAuth, id: string) => detail(departmentOf(auth).id, id),

    async list(auth: RequestAuth): Promise<ConstraintSetSummary[]> {
      const library = librarySet();
      const { constraints: _c, note: _n, versions: _v, ...librarySummary } = library;
      return [librarySummary, ...(await listConstraintSets(db, departmentOf(auth).id)).map(summary)];
    },

    library: () => ({ constraints: CONSTRAINT_LIBRARY, setId: LIBRARY_SET_ID }),

    async create(auth: RequestAuth, body: ConstraintSetBody): Promise<{ id: string }> {
      const department = departmentOf(auth);
      const constraints = checkConstraints(body.constraints as Record<string, unknown>[]);
      const id = newId();
      const now = new Date();
      await db.transaction(async (tx) => {
        await insertConstraintSet(
          tx,
          { id, departmentId: department.id, ownerUserId: auth.user.id, name: body.name, currentVersion: 1, createdAt: now, updatedAt: now },
          { setId: id, version: 1, constraints: constraints as Record<string, unknown>[], note: body.note ?? null, createdByUserId: auth.user.id, createdAt: now },
        );
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'constraintSet.created', target: id });
      });
      return { id };
    },

    /** Saves a new version (the library is read-only: it answers 404 here like any id the department does not own). */
    async update(auth: RequestAuth, id: string, body: ConstraintSetBody): Promise<ConstraintSet> {
      const department = departmentOf(auth);
      const constraints = checkConstraints(body.constraints as Record<string, unknown>[]);
      await db.transaction(async (tx) => {
        const locked = await lockConstraintSet(tx, department.id, id);
        if (!locked) throw constraintSetNotFound();
        const now = new Date();
        const version = locked.currentVersion + 1;
        await insertConstraintSetVersion(tx, { setId: id, version, constraints: constraints as Record<string, unknown>[], note: body.note ?? null, createdByUserId: auth.user.id, createdAt: now });
        await updateConstraintSetRow(tx, id, { currentVersion: version, name: body.name, updatedAt: now });
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'constraintSet.updated', target: id, detail: { version } });
      });
      return detail(department.id, id);
    },

    async remove(auth: RequestAuth, id: string): Promise<void> {
      const department = departmentOf(auth);
      await db.transaction(async (tx) => {
        const locked = await lockConstraintSet(tx, department.id, id);
        if (!locked) throw constraintSetNotFound();
        await updateConstraintSetRow(tx, id, { deletedAt: new Date() });
        await recordAudit(tx, { departmentId: department.id, actorUserId: auth.user.id, action: 'constraintSet.deleted', target: id });
      });
    },

    /** Scores a result against a set of the department (or the library). */
    async evaluate(departmentId: string, setId: string, result: EvaluableResult): Promise<Evaluation> {
      const set = await detail(departmentId, setId);
      return evaluateConstraints(result, resolveConstraints(set.constraints), { id: set.id, name: set.name, version: set.library ? null : set.currentVersion });
    },
  };
}

export type ConstraintSetsService = ReturnType<typeof createConstraintSetsService>;
export type { ObservedConstraint };
