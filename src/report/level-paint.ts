// The colour of each level word in the text reports.
import type { ChalkInstance } from 'chalk';
import type { RuleLevel } from '../engine/finding.js';

/** The chalk style of a level: error red, warning yellow, note cyan, off dim. */
export function paintForLevel(level: RuleLevel, paint: ChalkInstance): ChalkInstance {
  if (level === 'error') return paint.red;
  if (level === 'warning') return paint.yellow;
  return level === 'note' ? paint.cyan : paint.dim;
}
