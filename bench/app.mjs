#!/usr/bin/env node
/**
 * `npm run bench:app`: the app's performance budget, measured in headless Debian chromium.
 *   1. JavaScript transferred for the first screen (sum of the scripts the Plan screen loads, gzip-compressed here).
 *   2. Time from navigation to the Plan screen being usable, CPU throttled 4× (median of 5 cold loads).
 *   3. JS heap on the Align screen before and after N minutes (default 10) of emulated orientation events at 60 Hz.
 * Prints figures and the targets; it asserts nothing. Options: --minutes N, --skip-build.
 */
import { spawn, spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import os from 'node:os';
import { chromium } from 'playwright-core';

const PORT = 4183;
const BASE = `http://127.0.0.1:${PORT}`;
const argv = process.argv.slice(2);
const minutes = Number(argv[argv.indexOf('--minutes') + 1]) || (argv.includes('--minutes') ? 1 : 10);
const ARGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'];

if (!argv.includes('--skip-build')) {
  const b = spawnSync('npx', ['vite', 'build', '--logLevel', 'error'], { stdio: 'inherit' });
  if (b.status !== 0) process.exit(1);
}
const server = spawn('npx', ['vite', 'preview', '--host', '127.0.0.1', '--port', String(PORT), '--strictPort'], { stdio: 'ignore', detached: true });
const stop = () => { try { process.kill(-server.pid, 'SIGTERM'); } catch { /* already gone */ } };
process.on('exit', stop);
for (let i = 0; ; i++) {
  try { if ((await fetch(BASE + '/')).ok) break; } catch { /* starting */ }
  if (i > 150) throw new Error('preview server did not start');
  await new Promise((r) => setTimeout(r, 200));
}

const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', headless: true, args: ARGS });
const newPage = async () => {
  const ctx = await browser.newContext({ viewport: { width: 412, height: 915 }, serviceWorkers: 'block' });
  await ctx.addInitScript(() => localStorage.setItem('glintmark.settings.v1', JSON.stringify({ safetyAcknowledgedAtMs: 1 })));
  const page = await ctx.newPage();
  return { ctx, page, cdp: await ctx.newCDPSession(page) };
};
console.log(`glintmark bench:app — chromium ${browser.version()}, node ${process.version}, ${os.cpus().length} cores`);

// 1. First-screen JavaScript.
{
  const { ctx, page } = await newPage();
  const scripts = new Set();
  page.on('response', (r) => { if (r.request().resourceType() === 'script') scripts.add(new URL(r.url()).pathname); });
  await page.goto(BASE + '/plan');
  await page.locator('[data-testid="result-azimuth"]').waitFor();
  await page.waitForLoadState('networkidle');
  let raw = 0, gz = 0;
  for (const p of scripts) {
    const buf = readFileSync('dist' + p);
    raw += buf.length;
    gz += gzipSync(buf, { level: 9 }).length;
  }
  console.log(`first-screen JavaScript: ${scripts.size} files, ${(raw / 1024).toFixed(1)} KB raw, ${(gz / 1024).toFixed(1)} KB gzip (target < 250 KB gzip)`);
  await ctx.close();
}

// 2. Time to a usable Plan screen with the CPU throttled 4×.
{
  const times = [];
  for (let i = 0; i < 5; i++) {
    const { ctx, page, cdp } = await newPage();
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    const t0 = Date.now();
    await page.goto(BASE + '/plan', { waitUntil: 'commit' });
    await page.waitForFunction(() => {
      const el = document.querySelector('[data-testid="result-azimuth"]');
      const input = document.querySelector('[data-testid="incidence-0"]');
      return !!el && /\d/.test(el.textContent ?? '') && !!input && !input.disabled;
    }, null, { timeout: 60_000, polling: 16 });
    times.push(Date.now() - t0);
    await ctx.close();
  }
  times.sort((a, b) => a - b);
  console.log(`Plan screen usable, CPU 4× throttled: median ${times[2]} ms (runs ${times.join(', ')} ms; target < 2000 ms)`);
}

// 3. Memory across a long run of orientation events on the Align screen.
{
  const { ctx, page, cdp } = await newPage();
  await page.goto(BASE + '/align');
  await page.waitForTimeout(1500);
  await cdp.send('HeapProfiler.enable');
  const heapMb = async () => {
    await cdp.send('HeapProfiler.collectGarbage');
    const { usedSize } = await cdp.send('Runtime.getHeapUsage');
    return usedSize / 1048576;
  };
  await page.evaluate(() => {
    let n = 0;
    const fire = () => {
      n++;
      const a = 100 + 2 * Math.sin(n / 50), b = 12 + Math.sin(n / 70), g = 0.5 * Math.cos(n / 30);
      const e = new DeviceOrientationEvent('deviceorientationabsolute', { alpha: a, beta: b, gamma: g, absolute: true });
      window.dispatchEvent(e);
      window.dispatchEvent(new DeviceOrientationEvent('deviceorientation', { alpha: a, beta: b, gamma: g, absolute: true }));
    };
    window.__gmSensorTimer = setInterval(fire, 1000 / 60);
    window.__gmEvents = () => n;
  });
  const h0 = await heapMb();
  const samples = [h0];
  const stepMs = Math.max(10_000, (minutes * 60_000) / 10);
  for (let t = 0; t < minutes * 60_000; t += stepMs) {
    await page.waitForTimeout(Math.min(stepMs, minutes * 60_000 - t));
    samples.push(await heapMb());
  }
  const events = await page.evaluate(() => window.__gmEvents());
  const h1 = samples[samples.length - 1];
  console.log(`Align screen heap after GC: ${h0.toFixed(2)} MB at start, ${h1.toFixed(2)} MB after ${minutes} min and ${events} orientation events (growth ${(h1 - h0).toFixed(2)} MB; target: no growth)`);
  console.log(`  heap samples (MB): ${samples.map((s) => s.toFixed(2)).join(', ')}`);
  await ctx.close();
}

await browser.close();
stop();
process.exit(0);
