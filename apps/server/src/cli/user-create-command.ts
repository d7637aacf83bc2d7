import { parseArgs } from 'node:util';
import { emailSchema, passwordSchema, roleSchema, roles, type User } from '@lotwise/shared';
import type { Config } from '../config';
import { createDataSource } from '../db/data-source';
import { openStore } from '../db/repositories';
import { AppError } from '../lib/app-error';
import { generatePassword } from '../modules/auth/passwords';
import { usersService } from '../modules/users/users.service';

export const usage = `Usage: npm run user:create -- --email <address> --role <${roles.join('|')}> [--name "<display name>"] [--password <password>] [--force]

Creates a Lotwise user. Without --password (or LOTWISE_PASSWORD in the environment) a strong
password is generated and printed once. Only allowed while the database has no active admin,
unless --force is given.`;

export interface CommandIo {
  out(line: string): void;
  err(line: string): void;
}

/** Runs `user:create`; answers the process exit code. */
export async function runUserCreate(
  argv: string[],
  env: NodeJS.ProcessEnv,
  config: Config,
  io: CommandIo,
): Promise<number> {
  let values;
  try {
    ({ values } = parseArgs({
      args: argv,
      options: {
        email: { type: 'string' },
        role: { type: 'string' },
        name: { type: 'string' },
        password: { type: 'string' },
        force: { type: 'boolean', default: false },
        help: { type: 'boolean', short: 'h', default: false },
      },
      strict: true,
    }));
  } catch (error) {
    io.err(`${(error as Error).message}\n\n${usage}`);
    return 1;
  }
  if (values.help) {
    io.out(usage);
    return 0;
  }

  const email = emailSchema.safeParse(values.email ?? '');
  if (!email.success) {
    io.err(`--email ${values.email ? 'must be an e-mail address' : 'is required'}\n\n${usage}`);
    return 1;
  }
  const role = roleSchema.safeParse(values.role ?? '');
  if (!role.success) {
    io.err(`--role must be one of: ${roles.join(', ')}\n\n${usage}`);
    return 1;
  }
  const given = values.password ?? env.LOTWISE_PASSWORD;
  const password = given ?? generatePassword();
  const passwordCheck = passwordSchema.safeParse(password);
  if (!passwordCheck.success) {
    io.err(`The password ${passwordCheck.error.issues[0]?.message ?? 'is not valid'}.`);
    return 1;
  }

  const dataSource = createDataSource(config.databaseUrl ?? config.databasePath);
  await dataSource.initialize();
  try {
    await dataSource.runMigrations({ transaction: 'all' });
    const store = openStore(dataSource);
    if (!values.force && (await store.repos.users.countActiveAdmins()) > 0) {
      io.err(
        'This database already has an admin: add users from the Admin screen, or pass --force.',
      );
      return 1;
    }
    const { user } = await usersService(store, config).create(
      {
        email: email.data,
        role: role.data,
        displayName: values.name?.trim() || email.data.split('@')[0] || email.data,
        password,
      },
      null,
    );
    io.out(describe(user));
    if (given === undefined) io.out(`Password (shown only now): ${password}`);
    return 0;
  } catch (error) {
    if (error instanceof AppError) {
      io.err(error.message);
      return 1;
    }
    throw error;
  } finally {
    await dataSource.destroy();
  }
}

function describe(user: User): string {
  return `Created user #${user.id}: ${user.displayName} <${user.email}>, role ${user.role}`;
}
