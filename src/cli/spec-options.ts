/**
 * What-if options shared by the verbs that read a system file: --temperature, --activity and
 * --metastable override the file's keys. Command-line values are checked here (errors name the
 * option; strict decimal text, so "" or "0x7" is refused, not read as 0 or 7); the merged document
 * is then validated as a whole.
 */
import type { Command } from 'commander';
import { Fields } from '../system/fields.js';
import { readSystemFile } from '../system/read.js';
import { readSpec, type SystemSpec, T_RANGE } from '../system/spec.js';

export interface SpecOverrides {
  temperature?: string;
  activity?: string;
  metastable?: boolean;
}

export function withSpecOptions(cmd: Command): Command {
  return cmd
    .option('--temperature <C>', 'override the file\'s temperature, °C')
    .option('--activity <a>', 'override the activity of dissolved species of the element')
    .option('--metastable', 'include the library\'s metastable phases (e.g. Fe(OH)3)');
}

export function loadSpecWith(path: string, o: SpecOverrides): SystemSpec {
  const f = new Fields('command line');
  const patch: Record<string, unknown> = {};
  if (o.temperature !== undefined) patch.temperature = f.numberText(o.temperature, '--temperature', { min: T_RANGE.min, max: T_RANGE.max });
  if (o.activity !== undefined) patch.activity = f.numberText(o.activity, '--activity', { positive: true, max: 100 });
  if (o.metastable) patch.metastable = true;
  const data = readSystemFile(path);
  if (Object.keys(patch).length && data && typeof data === 'object' && !Array.isArray(data)) {
    const d = { ...(data as Record<string, unknown>), ...patch };
    if (patch.activity !== undefined) delete d.concentration;
    return readSpec(d, path);
  }
  return readSpec(data, path);
}
