/**
 * `npm run admin:create -- <username> "<Display Name>"` with the password in the
 * environment variable KERFBOOK_ADMIN_PASSWORD (so it stays out of the shell history and
 * the process list). Creates the first admin of a real install; runs pending migrations
 * first so it also works on a brand-new database.
 */
import { createDb } from '../data/db';
import { migrate } from '../data/migrate';
import { createUserBody } from '../../shared/schemas/users';
import { describeApiError } from '../../shared/api-error';
import { toFieldErrors } from '../../shared/validation';
import { AppError } from '../app-error';
import { createUser } from '../services/people/users';

const USAGE = 'Usage: KERFBOOK_ADMIN_PASSWORD=… DATABASE_URL=mysql://… npm run admin:create -- <username> "<Display Name>" [e-mail]';

async function main(): Promise<number> {
  const [username, displayName, email] = process.argv.slice(2);
  // Migrating needs the owner account when the app has its own (README.md, "Database accounts").
  const databaseUrl = process.env['MIGRATION_DATABASE_URL'] || process.env['DATABASE_URL'];
  if (!username || !displayName || !databaseUrl) {
    console.error(USAGE);
    return 2;
  }
  const parsed = createUserBody.safeParse({
    username,
    displayName,
    email: email ?? '',
    roles: ['admin'],
    temporaryPassword: process.env['KERFBOOK_ADMIN_PASSWORD'] ?? '',
  });
  if (!parsed.success) {
    const errors = toFieldErrors(parsed.error).map((e) => (e.path === 'temporaryPassword' ? { ...e, path: 'KERFBOOK_ADMIN_PASSWORD' } : e));
    console.error(describeApiError({ errors }));
    return 2;
  }
  const db = createDb(databaseUrl);
  try {
    await migrate(db);
    const user = await createUser(db, { userId: null, name: 'command line (admin:create)', clientAddress: 'local' }, parsed.data, {
      passwordIsTemporary: false,
    });
    console.log(`Created admin "${user.username}" (${user.displayName}), id ${user.id}. Sign in with the password from KERFBOOK_ADMIN_PASSWORD.`);
    return 0;
  } catch (err) {
    if (err instanceof AppError) {
      console.error(describeApiError(err));
      return 1;
    }
    throw err;
  } finally {
    await db.destroy();
  }
}

main().then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  },
);
