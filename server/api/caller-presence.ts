import type { Response } from 'express';

/** Whether the caller is still waiting for the answer. */
export interface CallerPresence {
  /** True once the connection closed before the answer was sent (the caller cancelled or went away). */
  readonly gone: boolean;
}

/**
 * Watches the answer's connection from now on, so that long work can stop, and keep nothing,
 * when nobody is left to receive it. The response's `close` is the signal: the request's own
 * `close` fires as soon as its body has been read, which says nothing about the caller.
 */
export function callerPresence(response: Response): CallerPresence {
  let gone = false;
  response.once('close', () => {
    if (!response.writableFinished) gone = true;
  });
  return {
    get gone() {
      return gone || (response.socket?.destroyed ?? false);
    },
  };
}
