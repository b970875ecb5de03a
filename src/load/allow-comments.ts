// Reading `# isapart-allow RULE-ID: reason` comments, which suppress one finding on their line or the next.
import type { AllowComment, InputError } from './statement.js';

/** Where a comment stands: 1-based line and column of its `#`, and whether code precedes it on the line. */
export interface CommentSite {
  file: string;
  line: number;
  column: number;
  ownLine: boolean;
}

/** The outcome of reading one comment: an allow comment, a malformed one, or an ordinary comment. */
export type AllowCommentReading =
  | { kind: 'allow'; comment: AllowComment }
  | { kind: 'malformed'; error: InputError }
  | { kind: 'ordinary' };

const MARKER = 'isapart-allow';
const RIGHT_FORM = '# isapart-allow RULE-ID: reason, e.g. # isapart-allow kind-and-part: sold as one kit';
const RULE_ID = /^[A-Za-z0-9][A-Za-z0-9_.-]*$/;

/** Reads the text of a comment (what follows `#`) as an allow comment, if it is one. */
export function readAllowComment(commentText: string, site: CommentSite): AllowCommentReading {
  const text = commentText.trim();
  if (!text.startsWith(MARKER)) return { kind: 'ordinary' };
  const rest = text.slice(MARKER.length);
  // `isapart-allowed` or `isapart-allow-list` are ordinary words, not the marker.
  if (rest !== '' && !/^[\s:]/.test(rest)) return { kind: 'ordinary' };
  const colon = rest.indexOf(':');
  const ruleId = (colon < 0 ? rest : rest.slice(0, colon)).trim();
  const reason = colon < 0 ? '' : rest.slice(colon + 1).trim();
  const problem =
    ruleId === ''
      ? 'it names no rule id'
      : !RULE_ID.test(ruleId)
        ? `"${ruleId}" is not a rule id (one word of letters, digits and -)`
        : colon < 0
          ? 'it has no ":" followed by a reason'
          : reason === ''
            ? 'its reason after ":" is empty'
            : undefined;
  if (problem !== undefined) {
    return {
      kind: 'malformed',
      error: {
        file: site.file,
        line: site.line,
        column: site.column,
        message: `Malformed allow comment: ${problem}; it suppresses nothing.`,
        hint: `write it as ${RIGHT_FORM}`,
      },
    };
  }
  return { kind: 'allow', comment: { ...site, ruleId, reason } };
}
