/** Where a command writes; tests pass their own. */
export type Io = {stdout: NodeJS.WriteStream; stderr: NodeJS.WriteStream; env: NodeJS.ProcessEnv; stdin?: {isTTY?: boolean}};
