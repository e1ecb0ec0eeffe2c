/** Cooperative cancellation: long computations check the token between steps and stop early when it is set. */
export interface CancellationToken {
  readonly isCancellationRequested: boolean;
}

export const neverCancelled: CancellationToken = { isCancellationRequested: false };

export class CancellationSource {
  private cancelled = false;
  readonly token: CancellationToken;

  constructor() {
    const read = (): boolean => this.cancelled;
    this.token = {
      get isCancellationRequested(): boolean {
        return read();
      },
    };
  }

  cancel(): void {
    this.cancelled = true;
  }
}

/** Thrown (and caught at the analysis boundary) when a computation notices its token was cancelled. */
export class CancelledError extends Error {
  constructor() {
    super('cancelled');
    this.name = 'CancelledError';
  }
}

export function throwIfCancelled(token: CancellationToken | undefined): void {
  if (token?.isCancellationRequested) throw new CancelledError();
}
