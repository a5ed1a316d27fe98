import { expect } from 'vitest';
import { main } from '../../src/cli/main.ts';

/** Run the planner in-process and capture its output and status. */
export async function runCli(argv: string[]): Promise<{ code: number; stdout: string; stderr: string; json: () => unknown }> {
  let stdout = '';
  let stderr = '';
  const code = await main(argv, { stdout: (s) => (stdout += s), stderr: (s) => (stderr += s) });
  return { code, stdout, stderr, json: () => JSON.parse(stdout) };
}

/** A bad-input run: status 2, nothing on stdout, exactly one line on stderr without a stack trace. */
export async function expectUsageError(argv: string[], message: RegExp): Promise<void> {
  const r = await runCli(argv);
  expect(r.code).toBe(2);
  expect(r.stdout).toBe('');
  expect(r.stderr.trim().split('\n')).toHaveLength(1);
  expect(r.stderr).not.toMatch(/\bat .*\.ts:\d+/);
  expect(r.stderr).toMatch(message);
}
