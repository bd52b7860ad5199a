/**
 * Rubric patterns run on every response, so a pattern that can backtrack catastrophically could
 * stall the server. Plumbline refuses them rather than running them on another engine: a pattern
 * is refused when a repeated group holds a repeat ("(a+)+"), a repeated group holds an
 * alternation ("(a|ab)*"), or it uses back-references or look-behind. Everything else is linear
 * enough on V8's engine for response-sized text.
 *
 * @returns a message saying what is wrong, or null when the pattern is accepted.
 */
export function regexProblem(pattern: string): string | null {
  try {
    new RegExp(pattern, 'iu');
  } catch (error) {
    const reason = error instanceof Error ? error.message.replace(/^Invalid regular expression: \/.*\/[a-z]*: /, '') : String(error);
    return `is not a valid regular expression: ${reason}`;
  }
  if (/\\[1-9]|\\k</.test(pattern)) return 'uses a back-reference, which can take exponential time — rewrite it without one';
  if (/\(\?<[=!]/.test(pattern)) return 'uses look-behind — rewrite it without';
  // Walk the groups: for each, note whether it holds a quantifier or an alternation.
  const stack: { quantified: boolean; alternation: boolean }[] = [{ quantified: false, alternation: false }];
  let inClass = false;
  for (let i = 0; i < pattern.length; i++) {
    const c = pattern[i];
    if (c === '\\') {
      i++;
      continue;
    }
    if (inClass) {
      if (c === ']') inClass = false;
      continue;
    }
    if (c === '[') inClass = true;
    else if (c === '(') stack.push({ quantified: false, alternation: false });
    else if (c === '|') stack[stack.length - 1].alternation = true;
    else if (c === ')') {
      const group = stack.pop()!;
      const next = pattern[i + 1];
      const repeated = next === '*' || next === '+' || (next === '{' && /^\{\d*,\d*\}/.test(pattern.slice(i + 1)) && !/^\{\d+\}/.test(pattern.slice(i + 1)) && !/^\{0?,?1\}/.test(pattern.slice(i + 1)));
      if (repeated && group.quantified) return 'repeats a group that itself repeats (like "(a+)+"), which can backtrack catastrophically — remove the inner or outer repeat';
      if (repeated && group.alternation) return 'repeats a group of alternatives (like "(a|ab)*"), which can backtrack catastrophically — make the alternatives exclusive or drop the repeat';
      if (stack.length) stack[stack.length - 1].quantified ||= group.quantified || repeated;
    } else if (c === '*' || c === '+' || (c === '{' && /^\{\d+,\d*\}/.test(pattern.slice(i)))) stack[stack.length - 1].quantified = true;
  }
  return null;
}
