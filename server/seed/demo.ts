import { readFileSync } from 'node:fs';
import { occurrenceTableSchema } from '../../shared/contracts/occurrence-table.ts';
import type { Role } from '../../shared/contracts/roles.ts';
import type { RequestAuth } from '../lib/request-auth.ts';
import { createOccurrenceTablesService } from '../modules/occurrence-tables/occurrence-tables.service.ts';
import { createSamplesService } from '../modules/samples/samples.service.ts';
import { createScenarioBodySchema } from '../../shared/contracts/scenarios-api.ts';
import { loadPresets } from '../modules/scenarios/presets.ts';
import { createScenariosService } from '../modules/scenarios/scenarios.service.ts';
import type { Db } from '../db/client.ts';
import { newId } from '../db/columns.ts';
import { findUserByEmail, insertUser } from '../modules/auth/auth.repository.ts';
import { hashPassword } from '../modules/auth/password.ts';
import { findDepartmentByName, insertDepartment, insertMembership, membershipsOfUser } from '../modules/departments/departments.repository.ts';

/**
 * The demo department: an invented group with invented people, labelled as illustrative
 * wherever it appears. Seeding is idempotent: existing rows are left as they are.
 */
export const DEMO_DEPARTMENT = 'Harrowgate Stellar Populations Group (illustrative)';
const BASELINE_TABLE_NAME = 'Baseline companions (published fits)';
export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@harrowgate.example', name: 'Wren Aldous (demo admin)', role: 'admin' },
  { email: 'modeller@harrowgate.example', name: 'Tamsin Okonkwo-Hale (demo modeller)', role: 'modeller' },
  { email: 'observer@harrowgate.example', name: 'Ivo Marchetti (demo observer)', role: 'observer' },
];

/** Observed samples of the demo department: invented numbers, labelled as such. */
const DEMO_SAMPLES = [
  {
    name: 'Harrowgate 40 pc pilot survey (illustrative)',
    magnetic: 9,
    total: 78,
    setting: 'all' as const,
    fieldThresholdMG: 1,
    provenance: 'Invented numbers for the Tidefield demo; not an observation. A pretend volume-limited pilot of 78 white dwarfs, 9 with B ≥ 1 MG.',
    bins: [
      { kind: 'setting' as const, setting: 'single' as const, magnetic: 9, total: 61 },
      { kind: 'setting' as const, setting: 'detachedCompanion' as const, magnetic: 0, total: 17 },
      { kind: 'massBin' as const, massMinMsun: 0.5, massMaxMsun: 0.7, magnetic: 4, total: 52 },
      { kind: 'massBin' as const, massMinMsun: 0.7, massMaxMsun: 1.0, magnetic: 4, total: 22 },
      { kind: 'massBin' as const, massMinMsun: 1.0, massMaxMsun: 1.3, magnetic: 1, total: 4 },
    ],
  },
  {
    name: 'Harrowgate white dwarf + M dwarf pairs (illustrative)',
    magnetic: 0,
    total: 45,
    setting: 'detachedCompanion' as const,
    fieldThresholdMG: 1,
    provenance: 'Invented numbers for the Tidefield demo; not an observation. None of 45 pretend detached white dwarf + M dwarf pairs is magnetic.',
    bins: [],
  },
];

export interface DemoSeedResult {
  departmentId: string;
  created: boolean;
}

export async function seedDemo(db: Db, demoPassword: string): Promise<DemoSeedResult> {
  let department = await findDepartmentByName(db, DEMO_DEPARTMENT);
  const created = !department;
  const now = new Date();
  if (!department) {
    const id = newId();
    await insertDepartment(db, { id, name: DEMO_DEPARTMENT, createdAt: now });
    department = { id, name: DEMO_DEPARTMENT, createdAt: now };
  }
  const passwordHash = await hashPassword(demoPassword);
  for (const person of DEMO_USERS) {
    let user = await findUserByEmail(db, person.email);
    if (!user) {
      const id = newId();
      await insertUser(db, { id, email: person.email, name: person.name, passwordHash, createdAt: now });
      user = await findUserByEmail(db, person.email);
    }
    if (!user) throw new Error(`could not create demo user ${person.email}`);
    const memberships = await membershipsOfUser(db, user.id);
    if (!memberships.some((m) => m.departmentId === department.id)) {
      await insertMembership(db, { userId: user.id, departmentId: department.id, role: person.role, createdAt: now });
    }
  }
  await seedDemoWork(db, department.id);
  return { departmentId: department.id, created };
}

/** The demo department's stored work: the baseline occurrence table, the example scenarios and the invented samples. */
async function seedDemoWork(db: Db, departmentId: string): Promise<void> {
  const modeller = await findUserByEmail(db, 'modeller@harrowgate.example');
  const observer = await findUserByEmail(db, 'observer@harrowgate.example');
  if (!modeller || !observer) return;
  const as = (user: { id: string; email: string; name: string }, role: Role): RequestAuth => ({
    user: { id: user.id, email: user.email, name: user.name },
    department: { id: departmentId, name: DEMO_DEPARTMENT },
    role,
    memberships: [],
  });
  const modellerAuth = as(modeller, 'modeller');
  const observerAuth = as(observer, 'observer');

  const tables = createOccurrenceTablesService(db);
  if (!(await tables.list(modellerAuth)).some((t) => t.name === BASELINE_TABLE_NAME)) {
    const baseline = occurrenceTableSchema.parse(JSON.parse(readFileSync(new URL('../../shared/scenarios/baseline-occurrence.json', import.meta.url), 'utf8')));
    await tables.create(modellerAuth, { name: BASELINE_TABLE_NAME, description: baseline.description, rows: baseline.rows });
  }

  const scenarios = createScenariosService(db, (dept, id) => tables.exists(dept, id));
  const existing = new Set((await scenarios.list(modellerAuth)).map((s) => s.name));
  for (const preset of loadPresets()) {
    if (existing.has(preset.title)) continue;
    // The presets come from a file, so they are parsed here at the edge like a request body.
    await scenarios.create(modellerAuth, createScenarioBodySchema.parse({ name: preset.title, document: preset.document, note: 'Example scenario shipped with Tidefield' }));
  }

  const samples = createSamplesService(db);
  const have = new Set((await samples.list(observerAuth)).map((s) => s.name));
  for (const sample of DEMO_SAMPLES) if (!have.has(sample.name)) await samples.create(observerAuth, sample);
}
