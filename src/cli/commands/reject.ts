import { writeFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { InputError } from '../../core/common/InputError';
import { plotsRejectAndPromote } from '../../core/field/plotsRejectAndPromote';
import { parsePlotFile } from '../../io/plots/parsePlotFile';
import type { CliIo, Command } from '../command';
import { readInputFile } from '../readInput';

const USAGE = `stratplot reject <plots.geojson> --plot ID --reason TEXT --out FILE [--at TIME]

Records that a crew cannot sample a plot (unsafe, flooded, no permission...) in the plot file:
the plot is marked rejected with the reason and the time, and the next reserve of its stratum
in rank order is promoted to replace it (the choice is never the crew's). Every later export
of the file shows the plot struck out with its reason and the reserve as the plot to visit.
Undo with stratplot restore.

  --plot ID       the plot to reject (a primary, or a promoted reserve)
  --reason TEXT   why it cannot be sampled, e.g. "Unsafe to reach"
  --out FILE      plot file to write (.geojson or .json; may be the input file)
  --at TIME       when it was decided, ISO 8601 (default: now)

Never enter ground that is unsafe on the day: local regulations, the landholder's permission
and your employer's safety plan govern.`;

/** Writes a plot file where stratplot plan writes it: GeoJSON text, as JSON.stringify gives it. */
export async function plotFileWrite(io: CliIo, out: string, text: string): Promise<void> {
  const ext = out.includes('.') ? out.slice(out.lastIndexOf('.') + 1).toLowerCase() : '';
  if (ext !== 'geojson' && ext !== 'json') throw new InputError(`--out ${out}: a plot file is written as .geojson (or .json)`);
  try {
    await writeFile(resolve(io.cwd, out), text);
  } catch (error) {
    throw new InputError(`cannot write ${out}: ${(error as Error).message}`);
  }
}

/** `stratplot reject`: marks a plot rejected in a plot file and promotes the next reserve. */
export const rejectCommand: Command = {
  summary: 'record a plot the crew cannot sample (reason, time) and promote the next reserve',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const parsed = parse(argv);
    const { values: o, positionals } = parsed;
    if (positionals.length !== 1) throw new InputError('give one plot file, e.g. stratplot reject plots.geojson --plot HEA-03 --reason "Unsafe to reach" --out plots.geojson');
    if (!o.plot) throw new InputError('--plot ID is required: the plot to reject');
    if (!o.reason?.trim()) throw new InputError('--reason TEXT is required: why the plot cannot be sampled');
    if (!o.out) throw new InputError('--out FILE is required');
    const at = o.at ?? new Date().toISOString();
    if (Number.isNaN(new Date(at).getTime())) throw new InputError(`--at needs an ISO 8601 time such as 2026-12-01T09:30:00Z, got "${at}"`);
    const file = await readInputFile(io, positionals[0]);
    const plots = parsePlotFile(file.name, file.bytes);
    const { collection, message } = plotsRejectAndPromote(plots, o.plot, o.reason, new Date(at).toISOString());
    await plotFileWrite(io, o.out, JSON.stringify(collection));
    io.out(`${message}\nwrote ${o.out}\n`);
    return 0;
  },
};

function parse(argv: string[]) {
  return parseArgs({
    args: argv,
    allowPositionals: true,
    strict: true,
    options: { plot: { type: 'string' }, reason: { type: 'string' }, out: { type: 'string' }, at: { type: 'string' } },
  });
}
