/**
 * `npm run bench`: prints measured figures. Nothing here asserts on time; tests never do either.
 * Each topic file exports `bench()`, which prints its own lines.
 */
import os from 'node:os';

const topics = ['reflector', 'orbit', 'data', 'backup', 'cli', 'horizon'] as const;

console.log(`glintmark bench — node ${process.version}, ${os.cpus().length} cores (${os.cpus()[0]?.model ?? 'unknown cpu'})`);
const only = process.argv[2];
for (const t of topics) {
  if (only && only !== t) continue;
  const mod = (await import(`./${t}.ts`)) as { bench: () => Promise<void> };
  console.log(`\n## ${t}`);
  await mod.bench();
}
