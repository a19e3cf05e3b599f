import { formatInches } from '../common/units/inches';
import { LayoutPlan } from './layout-planner';

/** Selvage's palette for layout drawings. */
export const LAYOUT_COLOURS = {
  block: '#F1EADC',
  sashing: '#1D5C63',
  cornerstone: '#C99A2E',
  borders: ['#A63D2F', '#1D5C63'],
  line: '#1E2430',
} as const;

export interface LayoutSvgOptions {
  /** Longest side of the drawing in CSS pixels; the viewBox stays in inches. */
  maxPixels?: number;
  /** Replaces the generated summary in <title>. */
  title?: string;
  numberBlocks?: boolean;
}

/** A to-scale drawing of the quilt top, one SVG user unit per inch. */
export function layoutSvg(plan: LayoutPlan, options: LayoutSvgOptions = {}): string {
  const { maxPixels = 480, numberBlocks = true } = options;
  const { width, height } = plan.top;
  const scale = maxPixels / Math.max(width, height);
  const title = options.title ?? layoutSummary(plan);
  const line = Math.min(plan.blockWidth, plan.blockHeight) / 60;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${n(width)} ${n(height)}" ` +
      `width="${n(width * scale)}" height="${n(height * scale)}" role="img">`,
    `<title>${escapeXml(title)}</title>`,
    ...borderFrames(plan),
    ...sashingShapes(plan),
    ...blockShapes(plan, line, numberBlocks),
    `<rect x="0" y="0" width="${n(width)}" height="${n(height)}" fill="none" stroke="${LAYOUT_COLOURS.line}" stroke-width="${n(line * 2)}"/>`,
    '</svg>',
  ].join('\n');
}

/** The sentence a screen reader hears, e.g. "Quilt top 78 by 93 inches: 5 columns by 6 rows of 12 inch blocks". */
export function layoutSummary(plan: LayoutPlan): string {
  const block =
    plan.blockWidth === plan.blockHeight
      ? `${inches(plan.blockWidth)} inch`
      : `${inches(plan.blockWidth)} by ${inches(plan.blockHeight)} inch`;
  const parts = [
    `Quilt top ${inches(plan.top.width)} by ${inches(plan.top.height)} inches: ` +
      `${count(plan.columns, 'column')} by ${count(plan.rows, 'row')} of ${block} blocks`,
  ];
  if (plan.sashing > 0) {
    const where = plan.sashingAround ? 'around every block' : 'between blocks';
    parts.push(`${inches(plan.sashing)} inch sashing ${where}${plan.cornerstones ? ' with cornerstones' : ''}`);
  }
  if (plan.borders.length > 0) {
    parts.push(`${count(plan.borders.length, 'border')} (${plan.borders.map(inches).join(', ')} inches)`);
  }
  return parts.join(', ');
}

// Sixteenths, so that the summary never rounds a real dimension away.
function inches(value: number): string {
  return formatInches(value, 16);
}

function count(value: number, noun: string): string {
  return `${value} ${noun}${value === 1 ? '' : 's'}`;
}

// Borders are listed innermost first; each becomes an even-odd frame so it is one shape with a hole.
function borderFrames(plan: LayoutPlan): string[] {
  const { width, height } = plan.top;
  let inset = plan.borders.reduce((sum, border) => sum + border, 0);
  return plan.borders.map((border, index) => {
    const inner = inset;
    inset -= border;
    const outer = inset;
    const d = `${rectPath(outer, outer, width - 2 * outer, height - 2 * outer)} ${rectPath(inner, inner, width - 2 * inner, height - 2 * inner)}`;
    const colour = LAYOUT_COLOURS.borders[index % LAYOUT_COLOURS.borders.length];
    return `<path class="border" d="${d}" fill="${colour}" fill-rule="evenodd"/>`;
  });
}

function rectPath(x: number, y: number, w: number, h: number): string {
  return `M${n(x)} ${n(y)}h${n(w)}v${n(h)}h${n(-w)}z`;
}

interface Grid {
  origin: number;
  /** Distance from one block's start to the next's. */
  stepX: number;
  stepY: number;
  /** Offset of the first block from the origin: one sashing width when sashing runs round the outside. */
  lead: number;
}

function gridOf(plan: LayoutPlan): Grid {
  return {
    origin: plan.borders.reduce((sum, border) => sum + border, 0),
    stepX: plan.blockWidth + plan.sashing,
    stepY: plan.blockHeight + plan.sashing,
    lead: plan.sashingAround ? plan.sashing : 0,
  };
}

// One background rect for all sashing; blocks and cornerstones are drawn over it.
function sashingShapes(plan: LayoutPlan): string[] {
  if (plan.sashing <= 0) return [];
  const { origin } = gridOf(plan);
  const innerWidth = plan.top.width - 2 * origin;
  const innerHeight = plan.top.height - 2 * origin;
  const shapes = [
    `<rect class="sashing" x="${n(origin)}" y="${n(origin)}" width="${n(innerWidth)}" height="${n(innerHeight)}" fill="${LAYOUT_COLOURS.sashing}"/>`,
  ];
  if (plan.cornerstones) shapes.push(...cornerstoneShapes(plan));
  return shapes;
}

function cornerstoneShapes(plan: LayoutPlan): string[] {
  const { origin, stepX, stepY } = gridOf(plan);
  // Sashing lines sit before each block; round the outside they also sit before the first and after the last.
  const first = plan.sashingAround ? 0 : 1;
  const shift = plan.sashingAround ? 0 : -plan.sashing;
  const shapes: string[] = [];
  for (let row = first; row <= plan.rows - first; row++) {
    for (let column = first; column <= plan.columns - first; column++) {
      const x = origin + shift + column * stepX;
      const y = origin + shift + row * stepY;
      shapes.push(
        `<rect class="cornerstone" x="${n(x)}" y="${n(y)}" width="${n(plan.sashing)}" height="${n(plan.sashing)}" fill="${LAYOUT_COLOURS.cornerstone}"/>`,
      );
    }
  }
  return shapes;
}

function blockShapes(plan: LayoutPlan, line: number, numberBlocks: boolean): string[] {
  const { origin, stepX, stepY, lead } = gridOf(plan);
  const fontSize = Math.min(plan.blockWidth, plan.blockHeight) * 0.3;
  const shapes: string[] = [];
  for (let row = 0; row < plan.rows; row++) {
    for (let column = 0; column < plan.columns; column++) {
      const x = origin + lead + column * stepX;
      const y = origin + lead + row * stepY;
      shapes.push(
        `<rect class="block" x="${n(x)}" y="${n(y)}" width="${n(plan.blockWidth)}" height="${n(plan.blockHeight)}" ` +
          `fill="${LAYOUT_COLOURS.block}" stroke="${LAYOUT_COLOURS.line}" stroke-width="${n(line)}"/>`,
      );
      if (numberBlocks) {
        const label = row * plan.columns + column + 1;
        shapes.push(
          `<text x="${n(x + plan.blockWidth / 2)}" y="${n(y + plan.blockHeight / 2)}" font-size="${n(fontSize)}" ` +
            `text-anchor="middle" dominant-baseline="central" font-family="sans-serif" fill="${LAYOUT_COLOURS.line}">${label}</text>`,
        );
      }
    }
  }
  return shapes;
}

// Short, stable numbers keep the markup small and the tests readable.
function n(value: number): string {
  const rounded = Number(value.toFixed(4));
  return String(Object.is(rounded, -0) ? 0 : rounded);
}

export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);
}
