import { isMap, isSeq, parseDocument } from 'yaml';

/**
 * The rubric's text with new criterion weights, comments and layout kept: what the learned-weights
 * page hands to the editor as a draft. Criteria not named keep their weight.
 */
export function rubricSourceWithWeights(source: string, weights: Record<string, number>): string {
  const doc = parseDocument(source);
  const criteria = doc.get('criteria', true);
  if (!isSeq(criteria)) return source;
  for (const node of criteria.items) {
    if (!isMap(node)) continue;
    const id = node.get('id');
    if (typeof id === 'string' && id in weights) node.set('weight', weights[id]);
  }
  return doc.toString({ lineWidth: 0 });
}
