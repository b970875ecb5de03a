// Summarises a V8 .cpuprofile (as `node --cpu-prof` writes it) into the functions with the most self time.
import { readFileSync } from 'node:fs';
import path from 'node:path';

/** One function's share of the profile. */
export interface HotSpot {
  name: string;
  /** File (relative to `root` where it lies under it) and 1-based line. */
  location: string;
  selfMs: number;
  share: number;
}

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
}
interface CpuProfile {
  nodes: ProfileNode[];
  samples: number[];
  timeDeltas: number[];
}

/** The `limit` functions with the most self time; the time of a sample is the delta to the next one. */
export function hotSpots(profileFile: string, root: string, limit: number): HotSpot[] {
  const profile = JSON.parse(readFileSync(profileFile, 'utf8')) as CpuProfile;
  const byNode = new Map<number, ProfileNode>(profile.nodes.map((node) => [node.id, node]));
  const selfMicros = new Map<string, number>();
  let total = 0;
  for (let index = 0; index < profile.samples.length; index += 1) {
    const delta = profile.timeDeltas[index + 1] ?? 0;
    const frame = byNode.get(profile.samples[index])?.callFrame;
    if (!frame) continue;
    const url = frame.url.startsWith('file://') ? new URL(frame.url).pathname : frame.url;
    const file = url.startsWith(root) ? path.relative(root, url) : url;
    const key = `${frame.functionName || '(anonymous)'}\t${file ? `${file}:${frame.lineNumber + 1}` : ''}`;
    selfMicros.set(key, (selfMicros.get(key) ?? 0) + delta);
    total += delta;
  }
  return [...selfMicros.entries()]
    .sort((a, b) => b[1] - a[1])
    .slice(0, limit)
    .map(([key, micros]) => {
      const [name, location] = key.split('\t');
      return { name, location, selfMs: micros / 1000, share: total > 0 ? micros / total : 0 };
    });
}
