/** Bundles src/cli into dist-cli (the command and its second thread). */
export function buildCli(): Promise<void>;
