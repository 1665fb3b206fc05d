/** What a command may do besides printing: raise the process exit status. */
export interface CommandContext {
  setExitCode(code: number): void;
}
