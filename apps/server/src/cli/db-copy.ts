import { ConfigError, loadConfig } from '../config';
import { runDbCopy } from './db-copy-command';

try {
  process.exitCode = await runDbCopy(process.argv.slice(2), loadConfig(), {
    out: (line) => console.log(line),
    err: (line) => console.error(line),
  });
} catch (error) {
  console.error(error instanceof ConfigError ? error.message : error);
  process.exitCode = 1;
}
