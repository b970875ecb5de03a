// The `contexts:` key of isapart.yaml: local copies of JSON-LD contexts, by the IRI documents name them with.
import path from 'node:path';
import { isMap } from 'yaml';
import type { IsapartConfig } from './config.js';
import { iriProblem } from './iri-check.js';
import { blameNode, describeNode, mappingEntries, reportAt, stringValue, type MappingEntry, type YamlReadContext } from './yaml-nodes.js';

const EXAMPLE = '`contexts: { "https://data.northvale-rail.example/context.jsonld": ./contexts/northvale.jsonld }`';

/** `contexts: { IRI: PATH }` — each path relative to the config file's folder, kept absolute. */
export function readContexts(context: YamlReadContext, entry: MappingEntry, config: IsapartConfig): void {
  if (!isMap(entry.value)) {
    reportAt(context, blameNode(entry), `\`contexts\` must be a mapping from context IRI to a local file, found ${describeNode(entry.value)}`, `write ${EXAMPLE}`);
    return;
  }
  const base = path.dirname(path.resolve(context.file));
  for (const mapping of mappingEntries(context, entry.value)) {
    const problem = iriProblem(mapping.key);
    if (problem !== undefined) {
      reportAt(context, mapping.keyNode, `\`${mapping.key}\` in \`contexts\` is not an absolute IRI: ${problem}`, `write the context IRI exactly as documents name it in "@context", as in ${EXAMPLE}`);
      continue;
    }
    const file = stringValue(mapping.value);
    if (file === undefined || file.trim() === '') {
      reportAt(
        context,
        blameNode(mapping),
        `the local file for the context \`${mapping.key}\` must be a path, found ${file === undefined ? describeNode(mapping.value) : 'an empty path'}`,
        `write a path relative to this config file, as in ${EXAMPLE}`,
      );
      continue;
    }
    config.contexts[mapping.key] = path.resolve(base, file);
  }
}
