import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../app';
import { createDataSource } from '../db/data-source';
import { testConfig } from '../test/harness';
import { runUserCreate } from './user-create-command';

const dirs: string[] = [];
afterAll(() => dirs.forEach((dir) => rmSync(dir, { recursive: true, force: true })));

function freshConfig() {
  const dir = mkdtempSync(path.join(tmpdir(), 'lotwise-cli-'));
  dirs.push(dir);
  return testConfig(dir);
}

async function run(argv: string[], config = freshConfig(), env: NodeJS.ProcessEnv = {}) {
  const out: string[] = [];
  const err: string[] = [];
  const code = await runUserCreate(argv, env, config, {
    out: (line) => out.push(line),
    err: (line) => err.push(line),
  });
  return { code, out: out.join('\n'), err: err.join('\n'), config };
}

async function canSignIn(config: ReturnType<typeof freshConfig>, email: string, password: string) {
  const dataSource = createDataSource(config.databasePath);
  await dataSource.initialize();
  try {
    const response = await request(createApp({ dataSource, config }))
      .post('/api/auth/login')
      .send({ email, password });
    return response.status === 200 ? response.body.user : null;
  } finally {
    await dataSource.destroy();
  }
}

describe('npm run user:create', () => {
  it('when no password is given, then it migrates a new database, creates the admin and prints a generated password once', async () => {
    const result = await run([
      '--email',
      'Head@Example.test',
      '--role',
      'admin',
      '--name',
      'Head of Lab',
    ]);
    expect(result.code).toBe(0);
    expect(result.out).toMatch(/Created user #1: Head of Lab <head@example\.test>, role admin/);
    const password = /Password \(shown only now\): (\S+)/.exec(result.out)?.[1] ?? '';
    expect(password.length).toBeGreaterThanOrEqual(20);
    expect(await canSignIn(result.config, 'head@example.test', password)).toMatchObject({
      role: 'admin',
    });
  });

  it('when LOTWISE_PASSWORD is set, then that password is used and not printed', async () => {
    const result = await run(['--email', 'tech@example.test', '--role', 'manager'], freshConfig(), {
      LOTWISE_PASSWORD: 'from-the-environment',
    });
    expect(result.code).toBe(0);
    expect(result.out).not.toContain('from-the-environment');
    expect(
      await canSignIn(result.config, 'tech@example.test', 'from-the-environment'),
    ).toMatchObject({
      displayName: 'tech',
    });
  });

  it('when the e-mail or role is bad, then it exits 1 with a clear message', async () => {
    const badEmail = await run(['--email', 'not-an-address', '--role', 'admin']);
    expect(badEmail).toMatchObject({ code: 1 });
    expect(badEmail.err).toMatch(/--email must be an e-mail address/);
    const badRole = await run(['--email', 'a@example.test', '--role', 'owner']);
    expect(badRole.code).toBe(1);
    expect(badRole.err).toMatch(/--role must be one of: admin, manager, member, viewer/);
    const unknownOption = await run([
      '--email',
      'a@example.test',
      '--role',
      'admin',
      '--colour',
      'x',
    ]);
    expect(unknownOption.code).toBe(1);
    const shortPassword = await run([
      '--email',
      'a@example.test',
      '--role',
      'admin',
      '--password',
      'short',
    ]);
    expect(shortPassword.err).toMatch(/at least 10 characters/);
  });

  it('when an admin exists, then it refuses unless --force; a taken e-mail is refused too', async () => {
    const first = await run([
      '--email',
      'first@example.test',
      '--role',
      'admin',
      '--password',
      'first-password',
    ]);
    const second = await run(['--email', 'second@example.test', '--role', 'member'], first.config);
    expect(second.code).toBe(1);
    expect(second.err).toMatch(/already has an admin.*--force/);
    const forced = await run(
      ['--email', 'second@example.test', '--role', 'member', '--force'],
      first.config,
    );
    expect(forced.code).toBe(0);
    const twin = await run(
      ['--email', 'second@example.test', '--role', 'member', '--force'],
      first.config,
    );
    expect(twin.code).toBe(1);
    expect(twin.err).toMatch(/already exists/);
  });
});
