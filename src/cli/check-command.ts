// `isapart check`: normalise the options, run the library, write the report, return the exit code.
import path from 'node:path';
import { atOrAbove, check, exitCodeFor, parseRuleLevel, type FailOn } from '../check.js';
import type { Level } from '../engine/finding.js';
import { toJson } from '../report/json.js';
import { toSarif } from '../report/sarif.js';
import { toText } from '../report/text.js';
import type { Terminal } from './terminal.js';
import { writeFileAtomically } from './write-output.js';

/** The options of `isapart check` as commander parses them. */
export interface CheckCommandOptions {
  format: 'text' | 'json' | 'sarif';
  output?: string;
  config?: string;
  preset?: string[];
  rule?: string[];
  scope?: string[];
  root?: string[];
  failOn: FailOn;
  color: boolean;
  quiet?: boolean;
}

const FORMATTERS = { text: toText, json: toJson, sarif: toSarif } as const;

/** Parses `--rule ID=LEVEL` values; a malformed one is a usage error message. */
function parseRuleOptions(values: string[]): { levels: Record<string, string>; error?: string } {
  const levels: Record<string, string> = {};
  for (const value of values) {
    const [id, level, ...rest] = value.split('=');
    if (!id || level === undefined || rest.length > 0 || parseRuleLevel(level) === undefined) {
      return { levels, error: `--rule ${value}: expected ID=LEVEL with LEVEL one of error, warning, note, off (e.g. --rule orphan-class=off)` };
    }
    levels[id] = level;
  }
  return { levels };
}

/** Whether the text report may use colour. */
function colourAllowed(options: CheckCommandOptions, terminal: Terminal): boolean {
  if (!options.color || options.output) return false;
  if (terminal.env.NO_COLOR !== undefined && terminal.env.NO_COLOR !== '') return false;
  return terminal.outIsTty;
}

/** Runs `isapart check` and returns its exit code. */
export async function runCheckCommand(
  paths: string[],
  options: CheckCommandOptions,
  terminal: Terminal,
  commandLine: string,
): Promise<number> {
  const rules = parseRuleOptions(options.rule ?? []);
  if (rules.error) {
    terminal.err(`isapart: ${rules.error}\n`);
    return 2;
  }
  const result = await check({
    paths,
    cwd: terminal.cwd,
    stdin: terminal.stdin,
    configFile: options.config,
    presets: options.preset,
    scope: options.scope,
    roots: options.root,
    ruleLevels: rules.levels,
    color: colourAllowed(options, terminal),
    commandLine,
  });
  const threshold: Level = options.failOn === 'never' ? 'error' : options.failOn;
  const shown =
    options.quiet && options.format === 'text'
      ? result.findings.filter((finding) => atOrAbove(finding.level, threshold))
      : result.findings;
  const report = FORMATTERS[options.format](shown, result.context);
  if (options.output) {
    await writeFileAtomically(path.resolve(terminal.cwd, options.output), report);
  } else {
    terminal.out(report);
  }
  return exitCodeFor(result, options.failOn);
}
