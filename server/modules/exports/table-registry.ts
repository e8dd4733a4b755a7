import type { ExportTable } from './export-table.ts';

/**
 * A named table that can be derived from a source object (a run's result, a sweep's points,
 * a fit's posterior). `build` returns null when the source does not hold that table (e.g. an
 * engine-1 result has no cooling-age bins), so old and new results export what they have.
 */
export interface TableDefinition<Source> {
  name: string;
  title: string;
  /** One line for the table listing and the Exports section. */
  description: string;
  build(source: Source): ExportTable | null;
}

export interface TableListing {
  name: string;
  title: string;
  description: string;
  rows: number;
  columns: { name: string; unit: string | null; description: string }[];
}

/** The one place each kind of object declares its exportable tables. */
export class TableRegistry<Source> {
  private readonly definitions: TableDefinition<Source>[] = [];

  register(definition: TableDefinition<Source>): this {
    if (this.definitions.some((d) => d.name === definition.name)) throw new Error(`table "${definition.name}" is registered twice`);
    this.definitions.push(definition);
    return this;
  }

  names(): string[] {
    return this.definitions.map((d) => d.name);
  }

  /** Every table this source holds, built. */
  available(source: Source): ExportTable[] {
    return this.definitions.map((d) => d.build(source)).filter((t): t is ExportTable => t !== null);
  }

  /** One table by name, or undefined when the name is unknown or the source does not hold it. */
  build(name: string, source: Source): ExportTable | undefined {
    return this.definitions.find((d) => d.name === name)?.build(source) ?? undefined;
  }

  listing(source: Source): TableListing[] {
    return this.available(source).map((t) => ({
      name: t.name,
      title: t.title,
      description: t.description,
      rows: t.rows.length,
      columns: t.columns.map((c) => ({ name: c.name, unit: c.unit ?? null, description: c.description })),
    }));
  }
}
