// Command-line wiring: declares the commands and options, and turns errors into exit codes.
import { Command, CommanderError, Option } from 'commander';
import { RDF_EXTENSIONS } from '../load/format.js';
import { startLanguageServer } from '../lsp/server.js';
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
  $ isapart check data/ -f html -o report.html   a page to review in a browser: filters, and an
                                                 evidence diagram per finding (works offline)
  $ zcat dump.nt.gz | isapart check -            lint standard input (format sniffed)
  $ isapart check vocab/assets.owl --base https://data.northvale-rail.example/def/
                                                 lint RDF/XML whose relative IRIs need a base
  $ isapart check data/ --rule orphan-class=off --fail-on warning
  $ isapart check data/ --scope https://data.northvale-rail.example/ --root https://data.northvale-rail.example/def/Asset
  $ isapart check data/ --since origin/main       fail only on findings this branch adds
  $ isapart check data/ --baseline before.json   compare with a saved -f json (or -f sarif) report
  $ isapart check data/ -f sparql-update -o fix.rq   a fix script: review it, run it on a copy first
  $ isapart check --endpoint http://127.0.0.1:8890/sparql --graph https://data.northvale-rail.example/graph/assets
                                                 read the hierarchy from a SPARQL 1.1 endpoint and lint it here
  $ isapart check --endpoint http://127.0.0.1:8890/sparql --push-down
                                                 run every rule as a SPARQL query on the endpoint itself

  $ isapart check data/ --edit retire-class.ru   what a bulk edit would introduce and resolve, before it runs
  $ isapart check data/ --remove old.nt --add new.ttl --fail-on warning
                                                 the same for statements given as RDF files

Edits: --edit reads a SPARQL 1.1 Update (INSERT DATA, DELETE DATA, DELETE/INSERT ... WHERE with
triple patterns, GRAPH, VALUES and FILTER tests such as != and NOT EXISTS); isapart applies it to
the statements it read, in memory only, then --remove and --add files. Each finding is new (the
edit introduces it), unchanged, or no longer found (the edit resolves it); a new finding's evidence
names the edit's lines. Exit 1 when the edit introduces findings at or above --fail-on.
LOAD, CLEAR, DROP and the like, SERVICE, OPTIONAL, UNION, BIND, property paths and FILTER
functions are refused with their line: state the statements instead.
isapart only reads the edit, never runs it: review it and run it on a copy of the store first.

Baselines: a finding is new, unchanged (its fingerprint is in the baseline) or absent (only in the
baseline); only new ones count for the exit code and the summary. --since needs the revision in the
clone (in a shallow CI clone, fetch it first: git fetch --depth=1 origin main).
Fix scripts change data: isapart only writes them; review each block and try it on a copy first.

Exit codes: 0 nothing at or above --fail-on; 1 findings at or above it;
            2 a usage, config or input error (other files are still linted and reported).
Formats by extension: .ttl .trig .nt .nq, .rdf .owl (and .xml when named) as RDF/XML, .jsonld;
each also as .gz. JSON-LD contexts are never fetched: map remote ones to files under contexts:.
Suppress one finding with a comment at the end of the statement's line, or alone on the line above
it:   # isapart-allow RULE-ID: reason      (RDF/XML: <!-- isapart-allow RULE-ID: reason -->)
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
  $ isapart check extract.ttl        lint a Turtle, TriG, N-Triples, N-Quads, RDF/XML or JSON-LD file (a folder, - for stdin)
  $ isapart rules                    the rules, their levels and what each flags
  $ isapart explain kind-and-part    one rule's description with a flagged and a clean example
  $ isapart init                     write a commented starter isapart.yaml here

Exit codes: 0 nothing at or above --fail-on; 1 findings at or above it; 2 a usage, config or input error.
Run 'isapart help check' for the options of check.`;

const LSP_HELP = `
The editor starts it and talks to it; it lints every ${RDF_EXTENSIONS.join(', ')} file under the
workspace folders (with the isapart.yaml found there), open buffers in place of the files on disk.
Generic client setup: command "isapart", arguments ["lsp", "--stdio"]. See README, "Editors".`;

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
    .addOption(
      new Option('-f, --format <format>', 'output format; html: one self-contained page with a diagram per finding; sparql-update: a fix script to review, never run by isapart')
        .choices(['text', 'json', 'sarif', 'html', 'sparql-update'])
        .default('text'),
    )
    .option('-o, --output <file>', 'write the report to a file (atomically) instead of standard output')
    .option('-c, --config <file>', 'config file (default: nearest isapart.yaml upward from the first path)')
    .option('--preset <names>', 'add role presets, comma-separated: rdfs,owl,dcterms,schema,obo,skos', collectList)
    .option('--rule <id=level>', "set a rule's level: error|warning|note|off (repeatable)", collect)
    .option('--scope <prefix>', 'an in-scope IRI prefix; only its nodes are reported (repeatable)', collect)
    .option('--root <iri>', 'a class allowed to have no superclass (repeatable)', collect)
    .option('--base <iri>', "the IRI relative IRIs resolve against when a file sets none (xml:base, @base); default the file's file:// URL")
    .addOption(
      new Option('--fail-on <level>', 'lowest level that makes the exit code 1')
        .choices(['error', 'warning', 'note', 'never'])
        .default('error'),
    )
    .option('--baseline <file>', 'an earlier JSON or SARIF report of isapart: only findings not in it are new and count for the exit code')
    .option('--since <rev>', 'lint the same paths as they were at git revision REV (read from git, no checkout) and use that as the baseline')
    .option('--no-color', 'no colour in text output (also: NO_COLOR, or output not a terminal)')
    .option('-q, --quiet', 'text output: only findings at or above --fail-on, and errors')
    .option('--no-progress', 'no progress bar while reading (it is drawn on standard error only when that is a terminal, and never in CI or with -q)')
    .option('--endpoint <url>', 'read the hierarchy from a SPARQL 1.1 endpoint instead of files (paged SELECT queries)')
    .option('--graph <iri>', 'with --endpoint: read this named graph (default: the endpoint\'s default graph)')
    .option('--push-down', 'with --endpoint: run the rules as SPARQL queries on the endpoint instead of extracting')
    .option('--edit <file>', 'lint a SPARQL 1.1 Update before it runs: report the findings it would introduce and resolve (nothing is written)', collect)
    .option('--add <file>', 'with or instead of --edit: an RDF file of statements the edit adds (repeatable)', collect)
    .option('--remove <file>', 'with or instead of --edit: an RDF file of statements the edit removes (repeatable)', collect)
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

  program
    .command('lsp')
    .description('run the language server (LSP 3.17) over standard input and output, for editors')
    .option('--stdio', 'talk over standard input and output (the only transport; accepted as editors pass it)')
    .option('--clientProcessId <pid>', 'exit when this editor process has gone (passed by some editors)')
    .addHelpText('after', LSP_HELP)
    .action(() => {
      if (process.stdin.isTTY) terminal.err('isapart lsp: waiting for an editor to talk LSP on standard input (Ctrl-C to stop); see isapart lsp --help\n');
      startLanguageServer(process.stdin, process.stdout);
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
