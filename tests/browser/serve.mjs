// The review page in a real browser: serve on a free port, refuse a
// request without the token, accept a finding by clicking, and find the
// decision in the database.
import { check, run, launch, artifacts } from './common.mjs';
import { spawn } from 'node:child_process';
import path from 'node:path';

run(['demo', '--output', 'demo'], [1]);  // 1: success with findings
const db = 'demo/edition.sqlite';
// Record the findings of one witness (exit code 1: findings were reported).
run(['errors', '--db', db, '--table', 'sun-eq', '--witness', 'D', '--auto'], [1]);

const server = spawn(process.env.APOGRAPH, ['serve', '--db', db, '--editor', 'Browser Test'],
                     { stdio: ['ignore', 'pipe', 'inherit'] });
const url = await new Promise((resolve, reject) => {
  let out = '';
  server.stdout.on('data', (d) => {
    out += d;
    const m = out.match(/http:\/\/127\.0\.0\.1:\d+\/\?token=[0-9a-f]{32}/);
    if (m) resolve(m[0]);
  });
  server.on('exit', (code) => reject(new Error('serve exited with ' + code + ': ' + out)));
  setTimeout(() => reject(new Error('serve printed no URL: ' + out)), 20000);
});
const browser = await launch();
try {
  const origin = new URL(url).origin;
  check((await fetch(origin + '/')).status === 403, 'a request without the token is refused');
  check((await fetch(origin + '/?token=' + '0'.repeat(32))).status === 403, 'a wrong token is refused');
  check((await fetch(url.replace('/?', '/..%2f..%2fetc/passwd?'))).status === 400,
        'an encoded path outside the pages is refused');

  const page = await browser.newPage();
  await page.goto(url, { waitUntil: 'load' });
  const id = await page.$eval('button[value="accept"]', (b) => b.dataset.id);
  check(!!id, 'the page lists a finding with an accept button');
  await Promise.all([page.waitForNavigation({ waitUntil: 'load' }),
                     page.click(`button[value="accept"][data-id="${id}"]`)]);
  check((await page.content()).includes('accepted'), 'the page says the finding was accepted');
  await page.screenshot({ path: path.join(artifacts, 'review-page.png'), fullPage: false });

  const list = JSON.parse(run(['emendation', 'list', '--format', 'json', '--db', db]));
  const decided = list.emendations.filter((e) => String(e.id) === id || String(e.finding) === id);
  check(decided.length >= 1 && decided.every((e) => e.status === 'accepted'),
        'the database has finding ' + id + ' accepted');
  check(decided.every((e) => e.editor === 'Browser Test' && !!e.decided_at && e.decision !== null),
        'the decision records who made it and when');
  const log = JSON.parse(run(['emendation', 'log', '--format', 'json', '--db', db]));
  check(log.decisions.filter((d) => String(d.finding) === decided[0].finding.toString()).length === 1,
        'one decision for the finding, as the command line records it');

  // The table's report, served by the same page, shows the decision.
  await page.goto(url.replace('/?', '/report?table=sun-eq&'), { waitUntil: 'load' });
  check(await page.$eval('.findings', () => document.querySelector('.decision.accepted') !== null &&
                           document.querySelector('.decision.accepted').textContent.includes('Browser Test')),
        'the report shows the finding accepted by the editor');

  // A second tab that still shows the finding as proposed is told it changed.
  const stale = await browser.newPage();
  await stale.goto(url, { waitUntil: 'load' });
  await stale.evaluate((i) => {
    const f = document.querySelector(`button[value="reject"][data-id="${i}"]`).form;
    f.querySelector('input[name="state"]').value = 'proposed';
  }, id);
  const [resp] = await Promise.all([stale.waitForNavigation({ waitUntil: 'load' }),
                                    stale.click(`button[value="reject"][data-id="${id}"]`)]);
  check(resp.status() === 409, 'a stale page is refused (409)');
  const after = JSON.parse(run(['emendation', 'list', '--format', 'json', '--db', db]));
  check(after.emendations.find((e) => String(e.id) === id).status === 'accepted',
        'the stale decision wrote nothing');
} finally {
  await browser.close();
  server.kill('SIGTERM');
}
