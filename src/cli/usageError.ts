/** A mistake in how a command was called or in what it was given: shown as a message (exit code 2), not as a fault. */
export class UsageError extends Error {}
