import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';

/** Finds a top-level folder of the repository (fixtures, fonts, email-templates) from src or dist. */
export function findUp(name: string, from: string = __dirname): string {
  let dir = from;
  for (;;) {
    const candidate = join(dir, name);
    if (existsSync(candidate)) return candidate;
    const parent = dirname(dir);
    if (parent === dir) throw new Error(`Could not find the ${name} folder above ${from}`);
    dir = parent;
  }
}
