/**
 * The figure options shared by the verbs that draw a figure into a document (report): size,
 * resolution, style, font, line width, decorations and a second potential axis.
 */
import type { Command } from 'commander';

export function withFigureFlags(cmd: Command): Command {
  return cmd
    .option('--width <length>', 'figure width: mm, or e.g. "170mm", "3in", "800px"')
    .option('--height <length>', 'figure height')
    .option('--dpi <n>', 'PNG resolution in dots per inch (default 300; 96 with a width in px)')
    .option('--style <style>', 'color, gray or lines')
    .option('--font <family>', 'font family')
    .option('--font-size <pt>', 'base font size in pt')
    .option('--line-width <pt>', 'width of boundary lines in pt')
    .option('--grid', 'draw a light grid')
    .option('--show <list>', 'decorations to show, comma-separated: water, grid, neutral, triplePoints, ligands, legend, title')
    .option('--hide <list>', 'decorations to hide, same names')
    .option('--ref <name>', "second potential axis against this reference electrode (sce, agcl-sat, cse, ...; default: the file's reference)");
}
