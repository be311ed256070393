/**
 * Renderer-neutral scene: what to draw, in figure coordinates (points, 1/72 in; origin top left,
 * y down). Built by scene.ts, drawn by svg.ts and pdf.ts so that both show the same figure.
 */

export type Point = [number, number];

/** A run of text with one baseline shift: counts are `sub`, charges and exponents `sup`. */
export interface TextRun {
  text: string;
  shift: 'normal' | 'sub' | 'sup';
  italic?: boolean;
}

export interface Rect {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface SubPath {
  points: Point[];
  closed: boolean;
}

export interface ScenePath {
  type: 'path';
  /** What the path is (CSS class in SVG): region, boundary, water, family, grid, frame, tick, leader, … */
  role: string;
  subpaths: SubPath[];
  fill: string | null;
  fillRule?: 'nonzero' | 'evenodd';
  stroke: string | null;
  strokeWidth: number;
  /** Dash pattern in pt, null for solid. */
  dash: number[] | null;
  lineCap?: 'butt' | 'round' | 'square';
  lineJoin?: 'miter' | 'round' | 'bevel';
  /** Extra attributes for SVG (data-*), e.g. { species: 'Fe^2+' }. */
  data?: Record<string, string>;
}

export interface SceneText {
  type: 'text';
  role: string;
  /** Anchor point: x per `anchor`, y is the baseline. */
  x: number;
  y: number;
  /** Base font size in pt (sub/superscripts are smaller). */
  size: number;
  anchor: 'start' | 'middle' | 'end';
  /** Rotation in degrees about (x, y), clockwise on the page (SVG convention); −90 reads upwards. */
  rotate: number;
  runs: TextRun[];
  fill: string;
  bold?: boolean;
  /** Layout box (axis-aligned, unrotated text only) that collision checks used. */
  box?: Rect;
  data?: Record<string, string>;
}

export interface SceneCircle {
  type: 'circle';
  role: string;
  cx: number;
  cy: number;
  r: number;
  fill: string | null;
  stroke: string | null;
  strokeWidth: number;
  data?: Record<string, string>;
}

export interface SceneGroup {
  type: 'group';
  role: string;
  /** Clip children to this rectangle. */
  clip?: Rect;
  children: SceneItem[];
}

export type SceneItem = ScenePath | SceneText | SceneCircle | SceneGroup;

/**
 * The plot's data ↔ figure mapping (figure units, pt; y down). x0 ↔ pH[0], x1 ↔ pH[1],
 * y0 ↔ E[0] (the bottom edge), y1 ↔ E[1] (the top edge); both axes are linear:
 * x = x0 + (pH − pH[0])·(x1 − x0)/(pH[1] − pH[0]), y = y0 + (E − E[0])·(y1 − y0)/(E[1] − E[0]).
 * E is in V vs SHE.
 */
export interface PlotFrame {
  x0: number;
  x1: number;
  y0: number;
  y1: number;
  pH: [number, number];
  E: [number, number];
}

export interface Scene {
  widthPt: number;
  heightPt: number;
  widthMm: number;
  heightMm: number;
  fontFamily: string;
  background: string;
  /** Plot area (inside the axes frame). */
  plot: Rect;
  /** Data ↔ figure mapping of the plot area. */
  frame: PlotFrame;
  items: SceneItem[];
  /** Title for document metadata. */
  title: string;
  /** What the layout did to fit the requested size (wrapped title, smaller fonts, …), once each. */
  notes: string[];
  /** The caption, when it was left out of the drawing to fit (kept as document metadata). */
  caption?: string;
}
