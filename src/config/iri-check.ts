// Checks that a string written in config is an absolute IRI, and says why when it is not.

/** An IRI scheme followed by its colon (RFC 3986 section 3.1: ALPHA *( ALPHA / DIGIT / "+" / "-" / "." )). */
const SCHEME = /^[A-Za-z][A-Za-z0-9+.-]*:/;

/**
 * Characters an IRI may not contain: those excluded by the IRIREF production of RDF 1.1 Turtle
 * (`[^#x00-#x20<>"{}|^\`\\]`, from memory), i.e. controls, space, and `<>"{}|\^\``.
 */
const FORBIDDEN = new Set(['<', '>', '"', '{', '}', '|', '\\', '^', '`']);

function describeCharacter(code: number): string {
  if (code === 0x20) return 'a space';
  if (code === 0x09) return 'a tab';
  if (code === 0x0a || code === 0x0d) return 'a line break';
  return `the control character U+${code.toString(16).toUpperCase().padStart(4, '0')}`;
}

/** Why a string is not an absolute IRI, or undefined when it is one. */
export function iriProblem(text: string): string | undefined {
  if (text.length === 0) return 'it is empty';
  if (text.startsWith('<') && text.endsWith('>')) return 'write the IRI without the angle brackets `<` and `>`';
  for (let index = 0; index < text.length; index++) {
    const code = text.charCodeAt(index);
    if (code <= 0x20) return `it contains ${describeCharacter(code)} at character ${index + 1}`;
    const character = text[index];
    if (FORBIDDEN.has(character)) return `it contains \`${character}\` at character ${index + 1}, which an IRI may not contain`;
  }
  if (text.startsWith('_:')) return 'it is a blank node label; only IRIs can be named in config';
  if (!SCHEME.test(text)) return 'it has no scheme; an absolute IRI starts with a scheme such as `https:`';
  return undefined;
}
