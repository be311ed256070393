/** Minimal typing for svgdom 0.1.x, which ships without declarations (tests only). */
declare module 'svgdom' {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  export function createSVGWindow(): any;
}
