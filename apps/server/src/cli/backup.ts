import { StartupError, loadConfig } from '../config';
import { runBackup } from './backup-command';

if (process.env.DATABASE_URL) {
  console.error(
    'DATABASE_URL is set: the database is PostgreSQL, whose backups are taken with pg_dump and restored with pg_restore (see docs/operations.md).',
  );
  process.exit(1);
}

try {
  process.exitCode = await runBackup(
    process.argv.slice(2),
    loadConfig(),
    { out: (line) => console.log(line), err: (line) => console.error(line) },
    // npm runs the script in apps/server; a FILE given relative means where the person typed it
    process.env.INIT_CWD ?? process.cwd(),
  );
} catch (error) {
  console.error(error instanceof StartupError ? error.message : error);
  process.exitCode = 1;
}
