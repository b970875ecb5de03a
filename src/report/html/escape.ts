// Escaping text for the HTML report: every IRI, label, literal and message goes through here.

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Text safe for element content and for a double-quoted attribute value (WHATWG HTML, section 13.1). */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (character) => HTML_ESCAPES[character]);
}

/** Shortens text to `limit` characters, keeping its end (the distinctive part of an IRI) after an ellipsis. */
export function shortenStart(text: string, limit: number): string {
  return text.length <= limit ? text : `…${text.slice(text.length - limit + 1)}`;
}

/** Shortens text to `limit` characters, keeping its start, with an ellipsis at the end. */
export function shortenEnd(text: string, limit: number): string {
  return text.length <= limit ? text : `${text.slice(0, limit - 1)}…`;
}
