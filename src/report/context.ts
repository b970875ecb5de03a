// What every formatter may read besides the findings: the run's inputs, rules and problems.
import type { RuleFailure, RuleLevel } from '../engine/finding.js';
import type { RuleDefinition } from '../engine/rule.js';
import type { GraphStats } from '../graph/hierarchy-graph.js';
import type { LineRemoval } from '../fix/text-removal.js';
import type { InputError, RdfFormat, Statement } from '../load/statement.js';
import type { PredicateMapping } from '../roles/role.js';

/** A rule as the run used it: its definition and its effective level. */
export interface RuleInUse {
  rule: RuleDefinition;
  level: RuleLevel;
}

/** What an edit run compared: the edit's files, and how many statements it adds, removes and ignores. */
export interface EditReport {
  /** The --edit file (a SPARQL 1.1 Update) and the --add / --remove files, in that order. */
  files: { file: string; role: 'edit' | 'add' | 'remove'; format: RdfFormat | 'sparql-update' }[];
  added: number;
  removed: number;
  /** Of the removed statements, those the data does not state (removing them changes nothing). */
  removedAbsent: number;
  /** Statements of the edit whose predicate the hierarchy does not read. */
  ignored: number;
  /** The statements the edit removes, at their places in the edit (so a resolved finding can name them). */
  removals?: Statement[];
  /** How the edited data's findings were computed: the graph patched or rebuilt, and the rules that ran in full. */
  evaluation?: EditEvaluationNote;
}

/** How an edit was evaluated: on the patched graph, re-running rules around the changes, or in full where it could not. */
export interface EditEvaluationNote {
  /** Why the graph was rebuilt from the edited statements instead of patched; undefined when patched. */
  rebuiltBecause?: string;
  /** Rules that ran over the whole edited graph rather than around the changes, with why. */
  fullRuns: { ruleId: string; reason: string }[];
  /** How many rules ran in all. */
  rules: number;
}

/** The context of one run, passed to every formatter beside the findings. */
export interface ReportContext {
  toolName: 'isapart';
  toolVersion: string;
  /** Paths in the output are made relative to this folder. */
  cwd: string;
  sources: { file: string; format: RdfFormat; statements: number }[];
  /** Syntax, input and config errors (any of them makes the run exit 2). */
  inputErrors: InputError[];
  /** Input read but not usable as stated (a literal object of a role predicate, a broken list); no effect on the exit code. */
  inputWarnings: InputError[];
  ruleFailures: RuleFailure[];
  /** Every known rule with its effective level (off ones included). */
  rules: RuleInUse[];
  configFile?: string;
  /** Prefixes declared in the sources (first declaration of a name wins), for compact statements. */
  prefixes?: Record<string, string>;
  stats?: GraphStats;
  /** rdfs:label or skos:prefLabel of the nodes the findings name, where stated (for the HTML report). */
  labels?: Record<string, string>;
  /** The role of each predicate in the findings' evidence, where it has one (for the HTML report's diagrams). */
  predicateRoles?: Record<string, PredicateMapping>;
  /** Colour for the text format. */
  color: boolean;
  startTime: Date;
  endTime: Date;
  /** The command line, for SARIF's invocation. */
  commandLine: string;
  /** When findings were compared with a baseline: what it was (a file, or a git revision), as shown to people. */
  baseline?: { source: string };
  /** When the findings are those of an edit compared with the data before it (`--edit`, `--add`, `--remove`). */
  edit?: EditReport;
  /** Fix statements whose removal is a safe deletion of whole lines of their file (for SARIF fixes). */
  removals?: ReadonlyMap<Statement, LineRemoval>;
}
