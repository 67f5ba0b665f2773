import { existsSync } from 'node:fs';

/** Whether something exists at `path` (a file or folder). Never throws. */
export function fileExists(path: string): boolean {
  try {
    return existsSync(path);
  } catch {
    return false;
  }
}
