/** Values kept in one text column as ",a,b," — each value between commas, so `like '%,a,%'` finds it exactly. */
export function delimited(values: Iterable<string>): string {
  const list = [...new Set(values)].sort();
  return list.length ? `,${list.join(',')},` : ',';
}
