import type { Command } from './command';

/** Every `stratplot` command by name; each lives in its own file under ./commands/. */
export const COMMANDS: Record<string, Command> = {};
