// The package's version, read once from package.json.
import { readFileSync } from 'node:fs';

let cached: string | undefined;

/** The version in isapart's package.json. */
export function toolVersion(): string {
  if (cached === undefined) {
    const text = readFileSync(new URL('../package.json', import.meta.url), 'utf8');
    cached = (JSON.parse(text) as { version: string }).version;
  }
  return cached;
}
