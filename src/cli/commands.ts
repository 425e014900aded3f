import type { Command } from './command';
import { areasCommand } from './commands/areas';
import { checkCommand } from './commands/check';
import { estimateCommand } from './commands/estimate';
import { exportCommand } from './commands/export';
import { planCommand } from './commands/plan';
import { recaptureCommand } from './commands/recapture';
import { rejectCommand } from './commands/reject';
import { restoreCommand } from './commands/restore';
import { trapsCommand } from './commands/traps';

/** Every `stratplot` command by name; each lives in its own file under ./commands/. */
export const COMMANDS: Record<string, Command> = {
  areas: areasCommand,
  check: checkCommand,
  estimate: estimateCommand,
  export: exportCommand,
  plan: planCommand,
  recapture: recaptureCommand,
  reject: rejectCommand,
  restore: restoreCommand,
  traps: trapsCommand,
};
