import type { Role } from '../../shared/contracts/roles.ts';
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
export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@harrowgate.example', name: 'Wren Aldous (demo admin)', role: 'admin' },
  { email: 'modeller@harrowgate.example', name: 'Tamsin Okonkwo-Hale (demo modeller)', role: 'modeller' },
  { email: 'observer@harrowgate.example', name: 'Ivo Marchetti (demo observer)', role: 'observer' },
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
  return { departmentId: department.id, created };
}
