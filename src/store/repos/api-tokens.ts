import { createHash, randomBytes } from 'node:crypto';
import type { Kysely } from 'kysely';
import { nowIso } from '../../clock.ts';
import type { Database } from '../schema.ts';
import { recordAudit } from './audit.ts';

export const TOKEN_SCOPES = ['import', 'export'] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];

const hash = (token: string) => createHash('sha256').update(token).digest('hex');

/** Creates a token and returns it in plain text — the only time it exists outside its hash. */
export async function createApiToken(db: Kysely<Database>, input: { name: string; scopes: TokenScope[]; createdBy: number }): Promise<{ id: number; token: string }> {
  const token = `plb_${randomBytes(32).toString('base64url')}`;
  const { id } = await db
    .insertInto('api_tokens')
    .values({ name: input.name, token_hash: hash(token), scopes: input.scopes.join(','), created_by: input.createdBy, created_at: nowIso(), revoked_at: null, last_used_at: null })
    .returning('id')
    .executeTakeFirstOrThrow();
  await recordAudit(db, { actorId: input.createdBy, kind: 'token_create', subject: `token:${id}`, detail: { name: input.name, scopes: input.scopes } });
  return { id, token };
}

/** The live (not revoked) token matching a presented value, marking it used. */
export async function findLiveToken(db: Kysely<Database>, token: string): Promise<{ id: number; name: string; scopes: TokenScope[]; createdBy: number | null } | undefined> {
  const row = await db.selectFrom('api_tokens').selectAll().where('token_hash', '=', hash(token)).where('revoked_at', 'is', null).executeTakeFirst();
  if (!row) return undefined;
  await db.updateTable('api_tokens').set({ last_used_at: nowIso() }).where('id', '=', row.id).execute();
  return { id: row.id, name: row.name, scopes: row.scopes.split(',').filter(Boolean) as TokenScope[], createdBy: row.created_by };
}

export function listApiTokens(db: Kysely<Database>) {
  return db.selectFrom('api_tokens').select(['id', 'name', 'scopes', 'created_at', 'revoked_at', 'last_used_at']).orderBy('id', 'desc').execute();
}

/** Revokes a token; it stops working at once. */
export async function revokeApiToken(db: Kysely<Database>, id: number, actorId: number): Promise<boolean> {
  const result = await db.updateTable('api_tokens').set({ revoked_at: nowIso() }).where('id', '=', id).where('revoked_at', 'is', null).executeTakeFirst();
  const changed = Number(result.numUpdatedRows) > 0;
  if (changed) await recordAudit(db, { actorId, kind: 'token_revoke', subject: `token:${id}` });
  return changed;
}
