import type { Kysely } from 'kysely';
import { generatePassword, hashPassword } from '../../auth/password.ts';
import { recordAudit } from './audit.ts';
import { parseRoles, type Role } from '../../auth/roles.ts';
import { nowIso } from '../../clock.ts';
import type { Database, User } from '../schema.ts';

/** What a user name may look like: 2–40 lower-case letters, digits, dots, hyphens or underscores. */
export const USERNAME = /^[a-z0-9][a-z0-9._-]{1,39}$/;

export interface UserInput {
  username: string;
  displayName: string;
  password: string;
  roles: Role[];
}

/** Creates a user with a scrypt-hashed password and returns its id. */
export async function createUser(db: Kysely<Database>, input: UserInput): Promise<number> {
  const row = await db
    .insertInto('users')
    .values({
      username: input.username,
      display_name: input.displayName,
      password_hash: await hashPassword(input.password),
      roles: input.roles.join(','),
      disabled: 0,
      created_at: nowIso(),
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return row.id;
}

export function findUserByName(db: Kysely<Database>, username: string): Promise<User | undefined> {
  return db.selectFrom('users').selectAll().where('username', '=', username).executeTakeFirst();
}

export function findUserById(db: Kysely<Database>, id: number): Promise<User | undefined> {
  return db.selectFrom('users').selectAll().where('id', '=', id).executeTakeFirst();
}

export function listUsers(db: Kysely<Database>): Promise<User[]> {
  return db.selectFrom('users').selectAll().orderBy('username').execute();
}

/** The roles a stored user holds. */
export function rolesOf(user: Pick<User, 'roles'>): Role[] {
  return parseRoles(user.roles);
}

/** Disables a user and ends their sessions, recorded in the audit log. */
export async function disableUser(db: Kysely<Database>, userId: number, actorId: number | null, via: 'cli' | 'web'): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.updateTable('users').set({ disabled: 1 }).where('id', '=', userId).execute();
    await trx.deleteFrom('sessions').where('user_id', '=', userId).execute();
    await recordAudit(trx, { actorId, kind: 'user_disable', subject: `user:${userId}`, detail: { via } });
  });
}

/** Gives a user a new generated password (returned once), re-enables them and ends their sessions. */
export async function resetUserPassword(db: Kysely<Database>, userId: number, actorId: number | null, via: 'cli' | 'web'): Promise<string> {
  const password = generatePassword();
  const hash = await hashPassword(password);
  await db.transaction().execute(async (trx) => {
    await trx.updateTable('users').set({ password_hash: hash, disabled: 0 }).where('id', '=', userId).execute();
    await trx.deleteFrom('sessions').where('user_id', '=', userId).execute();
    await recordAudit(trx, { actorId, kind: 'user_reset_password', subject: `user:${userId}`, detail: { via } });
  });
  return password;
}

/** Adds a user with a generated password (returned once), recorded in the audit log. */
export async function addUserWithPassword(db: Kysely<Database>, input: Omit<UserInput, 'password'>, actorId: number | null, via: 'cli' | 'web'): Promise<{ id: number; password: string }> {
  const password = generatePassword();
  const id = await createUser(db, { ...input, password });
  await recordAudit(db, { actorId, kind: 'user_add', subject: `user:${id}`, detail: { username: input.username, roles: input.roles, via } });
  return { id, password };
}
