/**
 * Every table of the database, gathered for drizzle-kit and for typed queries. The tables
 * themselves live beside their domain module (`server/modules/<domain>/<name>.table.ts`).
 */
export { users } from '../modules/auth/users.table.ts';
export { sessions } from '../modules/auth/sessions.table.ts';
export { departments, memberships } from '../modules/departments/departments.table.ts';
export { auditLog } from '../modules/audit/audit.table.ts';
