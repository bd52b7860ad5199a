import { createHash } from 'node:crypto';

/**
 * The order a reviewer sees an item's candidates in: a shuffle seeded by the reviewer and item,
 * so it is random across reviewers yet stable when the page reloads. Stored with the review.
 */
export function displayOrder(responseIds: string[], reviewerId: number, itemId: number): string[] {
  const key = (id: string) => createHash('sha256').update(`${reviewerId}:${itemId}:${id}`).digest('hex');
  return [...responseIds].sort((a, b) => (key(a) < key(b) ? -1 : 1));
}
