import bcrypt from 'bcryptjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { authOptions } from '@/lib/auth/options';
import { verifyCredentials } from '@/lib/data/users';
import { freshDb, type FreshDb } from '../models/fresh-db';

let db: FreshDb;

beforeAll(async () => {
  db = await freshDb();
  const passwordHash = bcrypt.hashSync('correct horse', 4);
  await db.models.User.create({ email: 'ines@sign-in.test', name: 'Ines', passwordHash });
  await db.models.User.create({
    email: 'left@sign-in.test',
    name: 'Left',
    passwordHash,
    active: false,
  });
});
afterAll(async () => db.cleanup());

// The credentials provider as next-auth calls it.
async function authorize(credentials: Record<string, string>) {
  const provider = authOptions.providers[0] as unknown as {
    options: { authorize: (c: Record<string, string>, req: unknown) => Promise<unknown> };
  };
  return provider.options.authorize(credentials, {});
}

describe('sign-in', () => {
  it('accepts the right password, whatever the e-mail case', async () => {
    const user = await verifyCredentials(' INES@sign-in.test ', 'correct horse');
    expect(user).toMatchObject({ email: 'ines@sign-in.test', name: 'Ines', isAdmin: false });
    expect(
      await authorize({ email: 'ines@sign-in.test', password: 'correct horse' }),
    ).toMatchObject({
      email: 'ines@sign-in.test',
    });
  });

  it('refuses a wrong password, an unknown e-mail and a deactivated account alike', async () => {
    expect(await verifyCredentials('ines@sign-in.test', 'correct horse ')).toBeNull();
    expect(await verifyCredentials('nobody@sign-in.test', 'correct horse')).toBeNull();
    expect(await verifyCredentials('left@sign-in.test', 'correct horse')).toBeNull();
    expect(await authorize({ email: 'ines@sign-in.test', password: 'wrong' })).toBeNull();
  });

  it('refuses malformed credentials before touching the database', async () => {
    expect(await authorize({ email: 'not an email', password: 'x' })).toBeNull();
    expect(await authorize({ email: 'ines@sign-in.test', password: '' })).toBeNull();
  });

  it('stores only bcrypt hashes', async () => {
    const row = await db.models.User.scope('withPassword').findOne({
      where: { email: 'ines@sign-in.test' },
    });
    expect(row?.passwordHash).toMatch(/^\$2[aby]\$\d{2}\$/);
    expect(row?.passwordHash).not.toContain('correct horse');
  });
});
