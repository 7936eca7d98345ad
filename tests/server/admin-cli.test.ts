import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import bcrypt from 'bcryptjs';
import type { Sequelize } from 'sequelize';
import { UserModel } from '../../server/models';
import { openTestDatabase, workerDatabaseUrl } from '../helpers/db';

const run = promisify(execFile);
const ROOT = path.resolve(__dirname, '../..');
const cli = (args: string[], env: Record<string, string> = {}) =>
  run(path.join(ROOT, 'node_modules/.bin/tsx'), [path.join(ROOT, 'server/cli/admin.ts'), ...args], {
    env: { ...process.env, NODE_OPTIONS: '', DATABASE_URL: workerDatabaseUrl(), JWT_SECRET: 'x'.repeat(40), NODE_ENV: 'development', ...env },
  });

let sequelize: Sequelize;
beforeAll(async () => {
  sequelize = await openTestDatabase();
});
afterAll(async () => {
  await sequelize.close();
});

describe('npm run admin', () => {
  it('creates an admin with a generated password printed once, hashed at cost 12', async () => {
    const { stdout } = await cli(['--email', 'Head@Example.test', '--name', 'Head Cook']);

    const password = /Password \(shown once[^)]*\): (\S+)/.exec(stdout)?.[1];
    expect(password).toBeDefined();
    const user = await UserModel.findOne({ where: { email: 'head@example.test' } });
    expect(user!.role).toBe('admin');
    expect(user!.displayName).toBe('Head Cook');
    expect(bcrypt.getRounds(user!.passwordHash)).toBe(12);
    expect(await bcrypt.compare(password!, user!.passwordHash)).toBe(true);
  });

  it('promotes an existing account and takes the password from ADMIN_PASSWORD', async () => {
    await UserModel.create({ email: 'member@example.test', displayName: 'M', passwordHash: 'x' });

    const { stdout } = await cli(['--email', 'member@example.test'], { ADMIN_PASSWORD: 'a chosen admin passphrase' });

    expect(stdout).not.toMatch(/shown once/);
    const user = await UserModel.findOne({ where: { email: 'member@example.test' } });
    expect(user!.role).toBe('admin');
    expect(await bcrypt.compare('a chosen admin passphrase', user!.passwordHash)).toBe(true);
  });

  it('refuses to run without an email', async () => {
    await expect(cli([])).rejects.toMatchObject({ stderr: expect.stringMatching(/--email/) });
  });
});
