import type { DataSource, EntitySubscriberInterface } from 'typeorm';
import { readConnection } from '../db/read-connection';

export interface RecordedStatement {
  query: string;
  parameters: unknown[];
}

/**
 * Records every statement the data source runs until `stop()`, on its writing connection and
 * on its read-only one (through a TypeORM subscriber, so statements run from TypeORM's
 * statement cache are seen too).
 */
export async function recordStatements(dataSource: DataSource) {
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
  const connections = [dataSource];
  const reader = await readConnection(dataSource);
  if (reader) connections.push(reader);
  for (const connection of connections) connection.subscribers.push(subscriber);
  return {
    statements,
    stop() {
      recording = false;
      for (const connection of connections) {
        const index = connection.subscribers.indexOf(subscriber);
        if (index >= 0) connection.subscribers.splice(index, 1);
      }
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
