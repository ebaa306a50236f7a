import type { DataSource, EntityTarget, ObjectLiteral } from 'typeorm';

/**
 * Entities from hand-written SQL, for the few lookups every request makes (who is calling, which
 * snapshot): TypeORM's query builder spends about 2 ms of CPU building and hydrating each of them,
 * a plain query 0.3 ms. The row's columns keep their database names (`SELECT s.*`, or `prefix_`
 * + name for a joined table); each becomes its entity property through TypeORM's own metadata and
 * value conversion, so the result is the same instance a `find` returns (relations not loaded).
 */
export class EntityRows<T extends ObjectLiteral> {
  private readonly metadata;
  private readonly selects = new Map<string, string>();

  constructor(private readonly dataSource: DataSource, target: EntityTarget<T>) {
    this.metadata = dataSource.getMetadata(target);
  }

  /** The table's columns, qualified by `alias` and renamed `prefix` + column (for joins); made once per alias. */
  select(alias: string, prefix = ''): string {
    const key = `${alias}\u0000${prefix}`;
    let list = this.selects.get(key);
    if (list === undefined) {
      list = this.metadata.columns.map((c) => `${alias}."${c.databaseName}"${prefix ? ` AS "${prefix}${c.databaseName}"` : ''}`).join(', ');
      this.selects.set(key, list);
    }
    return list;
  }

  /** The entity held in `row` (columns named `prefix` + column). */
  from(row: Record<string, unknown>, prefix = ''): T {
    const entity = this.metadata.create() as T;
    for (const column of this.metadata.columns) {
      column.setEntityValue(entity, this.dataSource.driver.prepareHydratedValue(row[prefix + column.databaseName], column));
    }
    return entity;
  }
}

const cache = new WeakMap<DataSource, Map<EntityTarget<ObjectLiteral>, EntityRows<ObjectLiteral>>>();

/** The EntityRows of `target` on `dataSource`, made once. */
export function entityRows<T extends ObjectLiteral>(dataSource: DataSource, target: EntityTarget<T>): EntityRows<T> {
  let byTarget = cache.get(dataSource);
  if (!byTarget) cache.set(dataSource, (byTarget = new Map()));
  let rows = byTarget.get(target);
  if (!rows) byTarget.set(target, (rows = new EntityRows(dataSource, target)));
  return rows as EntityRows<T>;
}
