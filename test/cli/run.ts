import { main } from '../../src/cli/main.ts';

/** Run the planner in-process and capture its output and status. */
export async function runCli(argv: string[]): Promise<{ code: number; stdout: string; stderr: string; json: () => unknown }> {
  let stdout = '';
  let stderr = '';
  const code = await main(argv, { stdout: (s) => (stdout += s), stderr: (s) => (stderr += s) });
  return { code, stdout, stderr, json: () => JSON.parse(stdout) };
}
