import { boolean, double, index, int, mysqlTable, text, varchar, mysqlEnum } from 'drizzle-orm/mysql-core';
import { idColumn, timestamp } from '../../db/columns.ts';

/**
 * Observed samples. A department's own samples have a department_id; the read-only library
 * of published constraints has department_id NULL and `citation` set, and every department
 * sees it. A sample states either counts (magnetic of total) or, where a paper gives only a
 * fraction, that fraction with its uncertainty or bound.
 */
export const samples = mysqlTable(
  'samples',
  {
    id: idColumn().primaryKey(),
    departmentId: idColumn('department_id'),
    ownerUserId: idColumn('owner_user_id'),
    /** Stable key of a library entry (e.g. "tout2008-wd-dm"); null for department samples. */
    libraryKey: varchar('library_key', { length: 64 }).unique(),
    name: varchar('name', { length: 200 }).notNull(),
    kind: mysqlEnum('kind', ['counts', 'fraction', 'meanMass']).notNull(),
    magnetic: int('magnetic'),
    total: int('total'),
    /** For kind = fraction: the published fraction, its 1σ uncertainty and whether it is a lower bound. */
    fraction: double('fraction'),
    fractionSigma: double('fraction_sigma'),
    lowerBound: boolean('lower_bound').notNull().default(false),
    /** For kind = meanMass: mean masses (Msun) of magnetic and non-magnetic white dwarfs with their ± as published. */
    meanMassMagneticMsun: double('mean_mass_magnetic_msun'),
    meanMassMagneticSigma: double('mean_mass_magnetic_sigma'),
    meanMassNonMagneticMsun: double('mean_mass_non_magnetic_msun'),
    meanMassNonMagneticSigma: double('mean_mass_non_magnetic_sigma'),
    /** The field strength the sample counts as magnetic (MG), when the source states one. */
    fieldThresholdMG: double('field_threshold_mg'),
    /** Which white dwarfs: all, single, or with a detached companion. */
    setting: mysqlEnum('setting', ['all', 'single', 'detachedCompanion']).notNull().default('all'),
    provenance: text('provenance'),
    citation: text('citation'),
    createdAt: timestamp('created_at').notNull(),
    updatedAt: timestamp('updated_at').notNull(),
  },
  (t) => [index('samples_department_idx').on(t.departmentId, t.updatedAt)],
);

/** Optional splits of a counts sample: by setting, or by white-dwarf mass bin. */
export const sampleBins = mysqlTable(
  'sample_bins',
  {
    id: int('id').autoincrement().primaryKey(),
    sampleId: idColumn('sample_id')
      .notNull()
      .references(() => samples.id, { onDelete: 'cascade' }),
    kind: mysqlEnum('kind', ['setting', 'massBin']).notNull(),
    setting: mysqlEnum('setting', ['single', 'wide', 'postCE', 'detachedCompanion']),
    massMinMsun: double('mass_min_msun'),
    massMaxMsun: double('mass_max_msun'),
    magnetic: int('magnetic').notNull(),
    total: int('total').notNull(),
  },
  (t) => [index('sample_bins_sample_idx').on(t.sampleId)],
);
