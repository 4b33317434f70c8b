import path from "node:path";
import { afterEach } from "vitest";
import { tempDir } from "./fixtures";

/**
 * For a describe block: a function that makes a data-directory path (`...segments` below a new
 * temporary directory, not created), every one removed after each test.
 */
export function dataDirs(...segments: string[]): () => string {
  const cleanups: (() => void)[] = [];
  afterEach(() => {
    while (cleanups.length) cleanups.pop()!();
  });
  return () => {
    const tmp = tempDir();
    cleanups.push(tmp.dispose);
    return path.join(tmp.dir, ...segments);
  };
}
