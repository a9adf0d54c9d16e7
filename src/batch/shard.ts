import { createHash } from 'node:crypto';

export interface Shard {
  /** 1-based index of this shard. */
  index: number;
  count: number;
}

/** Parses "K/N" (1 <= K <= N); returns a message naming the problem otherwise. */
export function parseShard(text: string): Shard | string {
  const match = /^(\d+)\/(\d+)$/.exec(text.trim());
  if (!match) return `--shard must look like K/N (for example 2/8), got "${text}"`;
  const index = Number(match[1]);
  const count = Number(match[2]);
  if (count < 1 || index < 1 || index > count) return `--shard ${text}: K must be between 1 and N`;
  return { index, count };
}

/**
 * Whether a document belongs to a shard. The choice depends only on the
 * path as reported (relative to the working folder, src/batch/inputs.ts;
 * hashed, so shards get similar shares of each folder), so every job of a
 * batch array started in the same folder with the same inputs splits them
 * the same way.
 */
export function inShard(path: string, shard: Shard): boolean {
  if (shard.count === 1) return true;
  const digest = createHash('sha256').update(path.replace(/\\/g, '/')).digest();
  return digest.readUInt32BE(0) % shard.count === shard.index - 1;
}
