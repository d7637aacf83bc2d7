import type { DataSource, EntitySubscriberInterface } from 'typeorm';

export interface RecordedStatement {
  query: string;
  parameters: unknown[];
}

/**
 * Records every statement the data source runs until `stop()` (through a TypeORM subscriber,
 * so statements run from TypeORM's statement cache are seen too).
 */
export function recordStatements(dataSource: DataSource) {
  const statements: RecordedStatement[] = [];
  let recording = true;
  const subscriber: EntitySubscriberInterface = {
    beforeQuery(event) {
      if (recording)
        statements.push({
          query: event.query,
          parameters: Array.isArray(event.parameters) ? event.parameters : [],
        });
    },
  };
  dataSource.subscribers.push(subscriber);
  return {
    statements,
    stop() {
      recording = false;
      const index = dataSource.subscribers.indexOf(subscriber);
      if (index >= 0) dataSource.subscribers.splice(index, 1);
      return statements;
    },
  };
}

/** The SELECT statements whose first table (after the first FROM) is `table`. */
export function readsOf(statements: RecordedStatement[], table: string): RecordedStatement[] {
  const pattern = new RegExp(
    `^\\s*SELECT\\b(?:(?!\\bFROM\\b)[\\s\\S])*\\bFROM\\s+"?${table}"?(\\s|$)`,
    'i',
  );
  return statements.filter((s) => pattern.test(s.query));
}
