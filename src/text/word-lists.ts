/**
 * Word lists the analysis uses. The stop words are our own selection of English function words
 * (common practice). The negation lists follow NegEx (Chapman et al. 2001): cues that negate
 * what follows, cues that negate what precedes, look-alike phrases that do not negate
 * ("pseudo-negation"), and terms that end a negation's scope.
 */
export const STOP_WORDS = new Set(
  `a about above after again against all am an and any are as at be because been before being below between both but by
  can could did do does doing down during each few for from further had has have having he her here hers herself him himself
  his how i if in into is it its itself just me more most my myself of off on once only or other our ours ourselves out over
  own same she should so some such than that the their theirs them themselves then there these they this those through to
  too under until up very was we were what when where which while who whom why will with would you your yours yourself
  yourselves also may might must shall let us it's i'm you're 's n't 're 'll 've 'd 'm get got make made one can't don't
  won't isn't aren't wasn't doesn't didn't`.split(/\s+/),
);

/** Cues that negate the words after them, up to a termination term or the clause's end. */
export const PRE_NEGATION_CUES: readonly string[] = [
  'no', 'not', "n't", 'never', 'without', 'cannot', 'nor', 'neither', 'none', 'nothing', 'nobody', 'nowhere',
  'deny', 'denies', 'denied', 'absence of', 'free of', 'avoid', 'avoids', 'avoiding', 'refrain from', 'rather than',
  'instead of', 'unable to', 'fails to', 'failed to', 'lack of', 'lacks',
];

/** Cues that negate the words before them in the same clause. */
export const POST_NEGATION_CUES: readonly string[] = ['unlikely', 'ruled out', 'is false', 'is a myth', 'is untrue', 'was ruled out'];

/** Phrases that contain a cue but do not negate. */
export const PSEUDO_NEGATIONS: readonly string[] = [
  'not only', 'not just', 'not necessarily', 'no doubt', 'without doubt', 'without a doubt', 'no increase', 'no change',
  'no wonder', 'no matter', 'nothing but', 'not to mention', "can't stress", 'cannot stress', "can't emphasize",
  'cannot emphasize', "can't wait", 'cannot wait', "can't recommend", 'cannot recommend', 'not sure', 'no later than',
  'not least',
];

/** Terms that end a negation's scope. */
export const NEGATION_TERMINATORS = new Set([
  'but', 'however', 'although', 'though', 'except', 'apart', 'yet', 'whereas', 'while', 'instead', 'so', 'because',
  'which', 'who', 'unless', 'then', 'and',
]);

/** Words that join a number to a following number in a range ("3 to 5 days"). */
export const RANGE_WORDS = new Set(['to', '-', '–', '—', 'and', 'or']);

export const MONTHS = new Set([
  'january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december',
  'jan', 'feb', 'mar', 'apr', 'jun', 'jul', 'aug', 'sep', 'sept', 'oct', 'nov', 'dec',
]);

export const NUMBER_WORDS: Record<string, number> = {
  zero: 0, one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12,
  fifteen: 15, twenty: 20, thirty: 30, forty: 40, fifty: 50, hundred: 100, half: 0.5,
};
