import { parseArgs } from 'node:util';
import { InputError } from '../../core/common/InputError';
import { plotsRestore } from '../../core/field/plotsRestore';
import { parsePlotFile } from '../../io/plots/parsePlotFile';
import type { CliIo, Command } from '../command';
import { readInputFile } from '../readInput';
import { plotFileWrite } from './reject';

const USAGE = `stratplot restore <plots.geojson> --plot ID --out FILE

Undoes stratplot reject: the plot is to be visited again, and the reserve promoted in its place
goes back to waiting, so the plot file is as it was before the rejection. When that reserve has
been rejected since, restore it first.

  --plot ID   the rejected plot to restore
  --out FILE  plot file to write (.geojson or .json; may be the input file)`;

/** `stratplot restore`: undoes a rejection in a plot file. */
export const restoreCommand: Command = {
  summary: 'undo a rejection: the plot is to be visited again, its reserve waits again',
  usage: USAGE,
  async run(argv: string[], io: CliIo): Promise<number> {
    const parsed = parse(argv);
    const { values: o, positionals } = parsed;
    if (positionals.length !== 1) throw new InputError('give one plot file, e.g. stratplot restore plots.geojson --plot HEA-03 --out plots.geojson');
    if (!o.plot) throw new InputError('--plot ID is required: the rejected plot to restore');
    if (!o.out) throw new InputError('--out FILE is required');
    const file = await readInputFile(io, positionals[0]);
    const { collection, message } = plotsRestore(parsePlotFile(file.name, file.bytes), o.plot);
    await plotFileWrite(io, o.out, JSON.stringify(collection));
    io.out(`${message}\nwrote ${o.out}\n`);
    return 0;
  },
};

function parse(argv: string[]) {
  return parseArgs({ args: argv, allowPositionals: true, strict: true, options: { plot: { type: 'string' }, out: { type: 'string' } } });
}
