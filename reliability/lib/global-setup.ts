import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { databaseUrl } from './database';
import type { Figure } from './figures';

const resultsFile = path.resolve(import.meta.dirname, '../results.json');

/**
 * Gives the tests a file to append their figures to; at the end prints every figure together
 * and writes reliability/results.json (git-ignored).
 */
export default function setup(project: TestProject) {
  const folder = mkdtempSync(path.join(tmpdir(), 'lotwise-reliability-figures-'));
  const file = path.join(folder, 'figures.jsonl');
  writeFileSync(file, '');
  project.provide('reliabilityFiguresFile', file);
  const started = new Date();

  return () => {
    const figures: Figure[] = existsSync(file)
      ? readFileSync(file, 'utf8')
          .split('\n')
          .filter(Boolean)
          .map((line) => JSON.parse(line) as Figure)
      : [];
    rmSync(folder, { recursive: true, force: true });
    const database = databaseUrl ? 'database URL (RELIABILITY_DATABASE_URL)' : 'SQLite files';
    console.log(`\nLotwise reliability figures (${database}, ${figures.length} tests):`);
    for (const figure of figures) console.log(`  [${figure.test}] ${figure.line}`);
    writeFileSync(
      resultsFile,
      `${JSON.stringify(
        {
          startedAt: started.toISOString(),
          finishedAt: new Date().toISOString(),
          database: databaseUrl ? 'url' : 'sqlite',
          node: process.version,
          figures,
        },
        null,
        2,
      )}\n`,
    );
    console.log(`Written to ${path.relative(process.cwd(), resultsFile)}\n`);
  };
}
