/**
 * Every table of the database, gathered for drizzle-kit and for typed queries. The tables
 * themselves live beside their domain module (`server/modules/<domain>/<name>.table.ts`).
 */
export { users } from '../modules/users/users.table.ts';
export { sessions } from '../modules/auth/sessions.table.ts';
export { departments, memberships } from '../modules/departments/departments.table.ts';
export { auditLog } from '../modules/audit/audit.table.ts';
export { scenarios, scenarioVersions } from '../modules/scenarios/scenarios.table.ts';
export { occurrenceTables, occurrenceRows } from '../modules/occurrence-tables/occurrence-tables.table.ts';
export { samples, sampleBins } from '../modules/samples/samples.table.ts';
export { runs, runCheckpoints, runCheckpointPoints, runResults, runBins, engulfmentGrids } from '../modules/runs/runs.table.ts';
export { sweeps } from '../modules/sweeps/sweeps.table.ts';
export { fits } from '../modules/fits/fits.table.ts';
export { apiTokens } from '../modules/tokens/tokens.table.ts';
export { billingAccounts, creditLedger, creditCheckouts, paymentEvents } from '../modules/billing/billing.table.ts';
export { invitations } from '../modules/invitations/invitations.table.ts';
export { passwordResets, notificationSettings } from '../modules/account/account.table.ts';
export { constraintSets, constraintSetVersions } from '../modules/constraints/constraint-sets.table.ts';
export { shareLinks } from '../modules/shares/share-links.table.ts';
export { emailChanges } from '../modules/account/email-changes.table.ts';
export { signUps } from '../modules/sign-up/sign-ups.table.ts';
