// The JSON-LD document loader: contexts come from local files only, and a remote one is never fetched.
import { readFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';

/** Context IRI → absolute path of its local copy (the `contexts:` key of isapart.yaml). */
export type ContextMap = ReadonlyMap<string, string>;

/** Why a context was not read, in the words of an InputError. */
export interface ContextRefusal {
  iri: string;
  message: string;
  hint: string;
}

/**
 * Serves JSON-LD contexts to the parser from disk: an IRI mapped in `contexts`, or a `file:` IRI
 * (a context next to the document). Any other IRI is refused without a network request, since the
 * network may be absent and fetching what a document names is a risk.
 */
export class LocalContextLoader {
  /** The first context that could not be served, for the error the parse ends with. */
  firstRefusal: ContextRefusal | undefined;
  private readonly contexts: ContextMap;

  constructor(contexts: ContextMap) {
    this.contexts = contexts;
  }

  /** The parsed JSON of the context at an IRI; rejects for a context it does not serve. */
  async load(iri: string): Promise<Record<string, unknown>> {
    const mapped = this.contexts.get(iri);
    const path = mapped ?? (iri.startsWith('file:') ? fileURLToPath(iri) : undefined);
    if (path === undefined) {
      throw this.refuse({
        iri,
        message: `the JSON-LD context <${iri}> is remote, and isapart does not fetch remote contexts`,
        hint: `save a copy of the context and map its IRI to the file in isapart.yaml: contexts: { "${iri}": ./contexts/local-copy.jsonld }`,
      });
    }
    let text: string;
    try {
      text = await readFile(path, 'utf8');
    } catch (error) {
      const reason = (error as NodeJS.ErrnoException).code ?? (error as Error).message;
      throw this.refuse({
        iri,
        message: `the JSON-LD context <${iri}> cannot be read from ${path} (${reason})`,
        hint: mapped !== undefined ? 'check the path given for this IRI under contexts: in isapart.yaml' : 'check that the context file exists next to the document',
      });
    }
    try {
      return JSON.parse(text) as Record<string, unknown>;
    } catch (error) {
      throw this.refuse({
        iri,
        message: `the JSON-LD context <${iri}> in ${path} is not valid JSON (${(error as Error).message})`,
        hint: 'a context file is a JSON object with an "@context" member',
      });
    }
  }

  private refuse(refusal: ContextRefusal): Error {
    this.firstRefusal ??= refusal;
    return new Error(refusal.message);
  }
}
