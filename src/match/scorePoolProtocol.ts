// The control block a score pool shares with each worker: a state word for Atomics.wait/notify, then arguments.

export const scorePoolProtocol = {
  /** Int32 slots: [state, kernel index, argument count]; then float64 arguments from byte `argsOffset`. */
  bytes: 256,
  argsOffset: 64,
  maxArgs: 16,
  starting: 0,
  idle: 1,
  work: 2,
  quit: 3,
  failed: 4,
} as const;
