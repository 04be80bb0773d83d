// The demo's HTML report in a real browser: plots, legend, stemma and cell
// links are there, and the page makes no network request at all.
import { check, run, launch, artifacts } from './common.mjs';
import path from 'node:path';

run(['demo', '--output', 'demo'], [1]);  // 1: success with findings
const file = 'file://' + path.resolve('demo/report.html');
const browser = await launch();
try {
  const page = await browser.newPage();
  const requests = [];
  page.on('request', (r) => requests.push(r.url()));
  await page.goto(file, { waitUntil: 'load' });
  const facts = await page.evaluate(() => {
    const links = [...document.querySelectorAll('a[href^="#cell-"]')];
    return {
      plots: document.querySelectorAll('svg.plot').length,
      legends: document.querySelectorAll('svg.legend').length,
      traces: document.querySelectorAll('svg.plot g.trace').length,
      slips: document.querySelectorAll('svg.plot .m-slip').length,
      departures: document.querySelectorAll('svg.plot .m-author').length,
      runs: document.querySelectorAll('svg.plot .m-run').length,
      stemmata: document.querySelectorAll('svg.stemma').length,
      links: links.length,
      dangling: links.filter((a) => !document.getElementById(a.getAttribute('href').slice(1))).length,
      scripts: document.querySelectorAll('script').length,
      tables: document.querySelectorAll('article.table').length,
    };
  });
  console.log(JSON.stringify(facts));
  check(facts.tables >= 3, 'one section per demo table');
  check(facts.plots >= facts.tables, 'at least one plot per table');
  check(facts.legends >= facts.tables, 'a legend with the plots');
  check(facts.traces >= 4 * facts.tables, 'one trace per witness');
  check(facts.slips > 0 && facts.departures > 0 && facts.runs > 0,
        'slips, displaced runs and the author\'s departures are marked apart');
  check(facts.stemmata >= 1, 'the stemma drawn as SVG');
  check(facts.links > 20, 'findings and plot marks link to cells');
  check(facts.dangling === 0, 'every cell link has its cell view');
  check(facts.scripts === 0, 'no script in the report');
  const foreign = requests.filter((u) => u !== file);
  check(foreign.length === 0, 'no request besides the file itself (' + foreign.join(', ') + ')');
  // Follow a link from a plot mark to its cell.
  const href = await page.$eval('svg.plot a', (a) => a.getAttribute('href'));
  await page.click('svg.plot a');
  check(await page.evaluate((h) => location.hash === h, href), 'a plot mark opens its cell');
  const table = await page.$('article.table');
  await table.screenshot({ path: path.join(artifacts, 'report-table.png') });
  check(true, 'screenshot written to ' + path.join(artifacts, 'report-table.png'));
} finally {
  await browser.close();
}
