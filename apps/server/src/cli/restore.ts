import { StartupError, loadConfig } from '../config';
import { runRestore } from './restore-command';

if (process.env.DATABASE_URL) {
  console.error(
    'DATABASE_URL is set: the database is PostgreSQL, whose backups are taken with pg_dump and restored with pg_restore (see docs/operations.md).',
  );
  process.exit(1);
}

try {
  // A missing database is what a restore may be for: production's refusal to start without
  // one does not apply here.
  const config = loadConfig({ ...process.env, DATABASE_INIT: 'true' });
  process.exitCode = runRestore(
    process.argv.slice(2),
    config,
    { out: (line) => console.log(line), err: (line) => console.error(line) },
    process.env.INIT_CWD ?? process.cwd(),
  );
} catch (error) {
  console.error(error instanceof StartupError ? error.message : error);
  process.exitCode = 1;
}
