import type { Kysely } from 'kysely';
import { hashPassword } from '../../auth/password.ts';
import { parseRoles, type Role } from '../../auth/roles.ts';
import { nowIso } from '../../clock.ts';
import type { Database, User } from '../schema.ts';

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
