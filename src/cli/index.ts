import { runCli } from './main';

const code = await runCli(process.argv.slice(2), {
  out: (t) => process.stdout.write(t),
  err: (t) => process.stderr.write(t),
  cwd: process.cwd(),
});
process.exitCode = code;
