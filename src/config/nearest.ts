// Edit distance and "did you mean" suggestions for misspelt keys, rule ids, roles and presets.

/**
 * The optimal string alignment distance: Levenshtein edits plus the swap of two adjacent
 * characters as one edit, so the common typo `scpoe` is one edit from `scope`. Three rows of memory.
 */
export function typoDistance(left: string, right: string): number {
  if (left === right) return 0;
  let beforePrevious = new Uint32Array(right.length + 1);
  let previous = new Uint32Array(right.length + 1);
  let current = new Uint32Array(right.length + 1);
  for (let j = 0; j <= right.length; j++) previous[j] = j;
  for (let i = 1; i <= left.length; i++) {
    current[0] = i;
    const leftCode = left.charCodeAt(i - 1);
    for (let j = 1; j <= right.length; j++) {
      const rightCode = right.charCodeAt(j - 1);
      let best = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + (leftCode === rightCode ? 0 : 1));
      if (i > 1 && j > 1 && leftCode === right.charCodeAt(j - 2) && left.charCodeAt(i - 2) === rightCode) {
        best = Math.min(best, beforePrevious[j - 2] + 1);
      }
      current[j] = best;
    }
    [beforePrevious, previous, current] = [previous, current, beforePrevious];
  }
  return previous[right.length];
}

/**
 * The candidate closest to a name, or undefined when none is close enough to be a likely typo:
 * at most a third of the longer string's length (and at least 1) edits away, a swap of two
 * neighbouring characters counting as one edit; case is ignored.
 */
export function nearestName(name: string, candidates: readonly string[]): string | undefined {
  const wanted = name.toLowerCase();
  let best: string | undefined;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (const candidate of candidates) {
    const distance = typoDistance(wanted, candidate.toLowerCase());
    const allowed = Math.max(1, Math.floor(Math.max(wanted.length, candidate.length) / 3));
    if (distance <= allowed && distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return best;
}

/** A hint for an unknown name: "did you mean `x`?" when one is close, and the list of known names. */
export function suggestionHint(name: string, candidates: readonly string[], what: string): string {
  const known = `known ${what}: ${candidates.join(', ')}`;
  const nearest = nearestName(name, candidates);
  return nearest === undefined ? known : `did you mean \`${nearest}\`? (${known})`;
}
