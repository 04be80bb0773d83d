// Shared by the browser tests: launching Debian's chromium headless and
// small checks that fail the test with a message.
import puppeteer from 'puppeteer-core';
import { execFileSync } from 'node:child_process';

export const apograph = process.env.APOGRAPH;
export const artifacts = process.env.ARTIFACTS;

export function check(condition, message) {
  if (!condition) {
    console.error('FAILED: ' + message);
    process.exit(1);
  }
  console.log('ok: ' + message);
}

/// Runs apograph; returns stdout. `allowed` exit codes besides 0 are not failures.
export function run(args, allowed = []) {
  try {
    return execFileSync(apograph, args, { encoding: 'utf8' });
  } catch (e) {
    if (allowed.includes(e.status)) return e.stdout;
    throw e;
  }
}

export async function launch() {
  return puppeteer.launch({
    executablePath: process.env.CHROMIUM,
    headless: 'new',
    // The CI container runs as root, where chromium's sandbox cannot start.
    args: ['--no-sandbox', '--disable-gpu', '--no-first-run'],
  });
}
