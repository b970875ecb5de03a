// Small horizontal bar charts as inline SVG, each bar labelled with its name and count (no colour needed to read it).
import { escapeHtml } from './escape.js';

/** One bar: its name, its count and the CSS class that colours it. */
export interface Bar {
  name: string;
  count: number;
  className: string;
}

const ROW_HEIGHT = 22;
const NAME_WIDTH = 190;
const BAR_WIDTH = 260;
const COUNT_WIDTH = 60;

/** A bar chart with one row per bar, scaled to the largest count. */
export function barChart(bars: readonly Bar[], title: string): string {
  const largest = Math.max(1, ...bars.map((bar) => bar.count));
  const width = NAME_WIDTH + BAR_WIDTH + COUNT_WIDTH;
  const height = Math.max(1, bars.length) * ROW_HEIGHT + 4;
  const rows = bars.map((bar, index) => {
    const y = index * ROW_HEIGHT + 2;
    const length = bar.count === 0 ? 0 : Math.max(2, Math.round((bar.count / largest) * BAR_WIDTH));
    return (
      `<g class="bar ${bar.className}"><title>${escapeHtml(`${bar.name}: ${bar.count}`)}</title>` +
      `<text class="bar-name" x="${NAME_WIDTH - 8}" y="${y + 15}">${escapeHtml(bar.name)}</text>` +
      `<rect x="${NAME_WIDTH}" y="${y + 3}" width="${length}" height="${ROW_HEIGHT - 6}"/>` +
      `<text class="bar-count" x="${NAME_WIDTH + length + 6}" y="${y + 15}">${bar.count}</text></g>`
    );
  });
  return `<svg class="chart" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img" aria-label="${escapeHtml(title)}">${rows.join('')}</svg>`;
}
