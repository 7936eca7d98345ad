/** A pair of names for the same food, both normalised (see normaliseSearchText). */
export type SynonymPair = { term: string; equivalent: string };

/** One concept of the query: the words as typed, or any of their other names; each alternative is a list of words. */
export type QueryGroup = { typed: string[]; alternatives: string[][] };

/**
 * Splits normalised query words into groups: a run of words that is a synonym's term or equivalent (longest first)
 * becomes one group whose alternatives are the run itself and every other name of it; other words stand alone.
 */
export function groupQuery(words: string[], synonyms: SynonymPair[]): QueryGroup[] {
  const others = new Map<string, Set<string>>();
  const link = (a: string, b: string) => {
    if (!others.has(a)) others.set(a, new Set());
    others.get(a)!.add(b);
  };
  for (const s of synonyms) {
    link(s.term, s.equivalent);
    link(s.equivalent, s.term);
  }
  const groups: QueryGroup[] = [];
  let i = 0;
  while (i < words.length) {
    let taken = 0;
    for (let len = Math.min(4, words.length - i); len >= 1 && !taken; len--) {
      const run = words.slice(i, i + len).join(' ');
      const alt = others.get(run);
      if (alt) {
        groups.push({ typed: words.slice(i, i + len), alternatives: [words.slice(i, i + len), ...[...alt].map((a) => a.split(' '))] });
        taken = len;
      }
    }
    if (!taken) {
      groups.push({ typed: [words[i]], alternatives: [[words[i]]] });
      taken = 1;
    }
    i += taken;
  }
  return groups;
}

/** A tsquery term for one word; the last typed word may also be a prefix (typing in progress). */
const term = (w: string, prefix: boolean) => (prefix ? `(${w} | ${w}:*)` : w);

/** One group as tsquery text: any of its alternatives, each with all of its words. */
export function groupTsQuery(g: QueryGroup, prefixLast: boolean): string {
  return `(${g.alternatives.map((alt) => alt.map((w, k) => term(w, prefixLast && k === alt.length - 1 && alt === g.alternatives[0])).join(' & ')).join(' | ')})`;
}

/**
 * The tsquery texts search uses (words are letters and digits only, so no operator can be injected):
 * `all` every group (the last typed word also as a prefix when `prefix`), `strict` the same without the prefix,
 * `any` at least one group (for ranking a food whose name starts with one of the words).
 */
export function foodTsQueries(groups: QueryGroup[], prefix: boolean): { all: string; strict: string; any: string } {
  const last = groups.length - 1;
  return {
    all: groups.map((g, i) => groupTsQuery(g, prefix && i === last)).join(' & '),
    strict: groups.map((g) => groupTsQuery(g, false)).join(' & '),
    any: groups.map((g) => groupTsQuery(g, false)).join(' | '),
  };
}
