// Hashes and sizes of the inputs, so an auditor can tell exactly which bytes were checked.
import { createHash } from 'node:crypto';
import { createReadStream, statSync } from 'node:fs';

export async function fileDigest(path: string): Promise<{ path: string; bytes: number; sha256: string }> {
  const hash = createHash('sha256');
  for await (const chunk of createReadStream(path)) hash.update(chunk as Buffer);
  return { path, bytes: statSync(path).size, sha256: hash.digest('hex') };
}
