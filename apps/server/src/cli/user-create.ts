import { ConfigError, loadConfig } from '../config';
import { runUserCreate } from './user-create-command';

try {
  const code = await runUserCreate(process.argv.slice(2), process.env, loadConfig(), {
    out: (line) => console.log(line),
    err: (line) => console.error(line),
  });
  process.exitCode = code;
} catch (error) {
  console.error(error instanceof ConfigError ? error.message : error);
  process.exitCode = 1;
}
