// Command-line wiring: declares the commands and options, and turns errors into exit codes.
import { Command, CommanderError, Option } from 'commander';
import { toolVersion } from '../version.js';
import { runCheckCommand, type CheckCommandOptions } from './check-command.js';
import { runExplainCommand, runInitCommand, runRulesCommand } from './other-commands.js';
import { runSparqlQueryCommand, type SparqlQueryCommandOptions } from './sparql-command.js';
import type { Terminal } from './terminal.js';
import { processTerminal } from './terminal.js';

const CHECK_EXAMPLES = `
Examples:
  $ isapart check extract.ttl                    lint one file
  $ isapart check data/ -f sarif -o lint.sarif   lint a folder, write SARIF for code scanning
  $ zcat dump.nt.gz | isapart check -            lint standard input (format sniffed)
  $ isapart check data/ --rule orphan-class=off --fail-on warning
  $ isapart check data/ --scope https://data.northvale-rail.example/ --root https://data.northvale-rail.example/def/Asset
  $ isapart check --endpoint http://127.0.0.1:8890/sparql --graph https://data.northvale-rail.example/graph/assets
                                                 read the hierarchy from a SPARQL 1.1 endpoint and lint it here
  $ isapart check --endpoint http://127.0.0.1:8890/sparql --push-down
                                                 run every rule as a SPARQL query on the endpoint itself

Exit codes: 0 nothing at or above --fail-on; 1 findings at or above it;
            2 a usage, config or input error (other files are still linted and reported).
Suppress one finding in a Turtle file with a comment at the end of the statement's line, or alone
on the line above it:   # isapart-allow RULE-ID: reason
Config: the nearest isapart.yaml upward from the first path ('isapart init' writes a starter).
Endpoint settings go in its endpoint: section (page-size, timeout, retries, retry-delay, post: query|form,
results: json|n-triples,
authorization-env: the NAME of an environment variable holding the Authorization header value).`;

const RULES_EXAMPLES = `
Examples:
  $ isapart rules                          the rules and their levels after config
  $ isapart rules --sparql kind-and-part   the query push-down runs for one rule, to read or run yourself
  $ isapart rules --sparql part-cycle --graph https://data.northvale-rail.example/graph/assets`;

const PROGRAM_HELP = `
Start:
  $ isapart check extract.ttl        lint a Turtle, TriG, N-Triples or N-Quads file (or a folder, or - for stdin)
  $ isapart rules                    the rules, their levels and what each flags
  $ isapart explain kind-and-part    one rule's description with a flagged and a clean example
  $ isapart init                     write a commented starter isapart.yaml here

Exit codes: 0 nothing at or above --fail-on; 1 findings at or above it; 2 a usage, config or input error.
Run 'isapart help check' for the options of check.`;

/** Collects a repeatable option's values. */
function collect(value: string, previous: string[] = []): string[] {
  return [...previous, value];
}

/** Collects comma-separated values of a repeatable option. */
function collectList(value: string, previous: string[] = []): string[] {
  return [...previous, ...value.split(',').map((item) => item.trim()).filter(Boolean)];
}

/** Builds the program; actions report their exit code through `setExit`. */
function buildProgram(terminal: Terminal, commandLine: string, setExit: (code: number) => void): Command {
  const program = new Command('isapart')
    .description('Lint the class hierarchy of an RDF graph: instance-of, subclass-of and part-of.')
    .version(toolVersion(), '-V, --version')
    .showHelpAfterError('(run with --help for usage)')
    .configureOutput({
      writeOut: (text) => terminal.out(text),
      writeErr: (text) => terminal.err(text),
    })
    .addHelpText('after', PROGRAM_HELP)
    .exitOverride();

  program
    .command('check')
    .description('lint RDF files, folders (recursively, by extension) or standard input (-)')
    .argument('[paths...]', 'files, folders, or - for standard input', ['.'])
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json', 'sarif']).default('text'))
    .option('-o, --output <file>', 'write the report to a file (atomically) instead of standard output')
    .option('-c, --config <file>', 'config file (default: nearest isapart.yaml upward from the first path)')
    .option('--preset <names>', 'add role presets, comma-separated: rdfs,owl,dcterms,schema,obo,skos', collectList)
    .option('--rule <id=level>', "set a rule's level: error|warning|note|off (repeatable)", collect)
    .option('--scope <prefix>', 'an in-scope IRI prefix; only its nodes are reported (repeatable)', collect)
    .option('--root <iri>', 'a class allowed to have no superclass (repeatable)', collect)
    .addOption(
      new Option('--fail-on <level>', 'lowest level that makes the exit code 1')
        .choices(['error', 'warning', 'note', 'never'])
        .default('error'),
    )
    .option('--no-color', 'no colour in text output (also: NO_COLOR, or output not a terminal)')
    .option('-q, --quiet', 'text output: only findings at or above --fail-on, and errors')
    .option('--endpoint <url>', 'read the hierarchy from a SPARQL 1.1 endpoint instead of files (paged SELECT queries)')
    .option('--graph <iri>', 'with --endpoint: read this named graph (default: the endpoint\'s default graph)')
    .option('--push-down', 'with --endpoint: run the rules as SPARQL queries on the endpoint instead of extracting')
    .addHelpText('after', CHECK_EXAMPLES)
    .action(async (paths: string[], options: CheckCommandOptions) => {
      setExit(await runCheckCommand(paths, options, terminal, commandLine));
    });

  program
    .command('rules')
    .description('list the rules (built-in and from rule-dirs) with their levels after config')
    .addOption(new Option('-f, --format <format>', 'output format').choices(['text', 'json', 'markdown']).default('text'))
    .option('-c, --config <file>', 'config file whose levels and rule-dirs apply (default: nearest isapart.yaml upward from here)')
    .option('--no-color', 'no colour in text output (also: NO_COLOR, or output not a terminal)')
    .option('--sparql <rule-id>', "print the rule's SPARQL 1.1 push-down query, with the roles, scope and roots it was compiled for")
    .option('--preset <names>', 'with --sparql: add role presets, as check does', collectList)
    .option('--scope <prefix>', 'with --sparql: an in-scope IRI prefix, as check does (repeatable)', collect)
    .option('--root <iri>', 'with --sparql: a configured root, as check does (repeatable)', collect)
    .option('--graph <iri>', 'with --sparql: query this named graph (FROM) instead of the default graph')
    .addHelpText('after', RULES_EXAMPLES)
    .action(async (options: { format: 'text' | 'json' | 'markdown'; config?: string; color: boolean } & SparqlQueryCommandOptions & { sparql?: string }) => {
      if (options.sparql !== undefined) setExit(await runSparqlQueryCommand(options.sparql, options, terminal));
      else setExit(await runRulesCommand(options, terminal));
    });

  program
    .command('explain')
    .description("show a rule's description and its flagged and clean examples")
    .argument('<rule-id>', 'a rule id, as listed by isapart rules')
    .option('-c, --config <file>', 'config file whose rule-dirs and levels apply')
    .action(async (ruleId: string, options: { config?: string }) => {
      setExit(await runExplainCommand(ruleId, options, terminal));
    });

  program
    .command('init')
    .description('write a commented starter isapart.yaml in the current folder')
    .option('--force', 'overwrite an existing isapart.yaml')
    .action(async (options: { force?: boolean }) => {
      setExit(await runInitCommand(options, terminal));
    });

  return program;
}

/** Runs the command line and returns the exit code; never calls process.exit. */
export async function main(argv: string[], terminal: Terminal = processTerminal()): Promise<number> {
  let exitCode = 0;
  const program = buildProgram(terminal, ['isapart', ...argv].join(' '), (code) => {
    exitCode = code;
  });
  try {
    await program.parseAsync(argv, { from: 'user' });
    return exitCode;
  } catch (error) {
    if (error instanceof CommanderError) {
      // Help and version exit with 0; usage errors with 2, as design.md's exit codes say.
      return error.exitCode === 0 ? 0 : 2;
    }
    terminal.err(`isapart: internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    return 2;
  }
}
