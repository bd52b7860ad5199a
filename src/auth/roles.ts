/** The roles a user may hold; a user may hold several. */
export const ROLES = ['reviewer', 'adjudicator', 'policy', 'data', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/** Parses the stored comma-separated role list, keeping only known roles. */
export function parseRoles(stored: string): Role[] {
  return stored
    .split(',')
    .map((r) => r.trim())
    .filter((r): r is Role => (ROLES as readonly string[]).includes(r));
}

/** True when `held` includes any of `wanted`; `admin` alone does not grant review work. */
export function hasAnyRole(held: readonly Role[], wanted: readonly Role[]): boolean {
  return wanted.some((role) => held.includes(role));
}
