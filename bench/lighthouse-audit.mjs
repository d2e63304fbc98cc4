// One Lighthouse run through its Node API, in plain Node: `node bench/lighthouse-audit.mjs <url> <chrome port>
// <categories>` prints the report (LHR) as JSON. Not under tsx, whose esbuild name helpers (`__name`) end up in the
// functions Lighthouse sends into the page, where they are not defined.
import lighthouse from 'lighthouse';

const [url, port, categories] = process.argv.slice(2);
// Lighthouse's default config: the mobile preset (emulated mid-range phone, simulated slow 4G, 4x CPU slowdown).
const result = await lighthouse(url, {
  port: Number(port),
  output: 'json',
  logLevel: 'error',
  onlyCategories: categories.split(','),
});
if (!result) throw new Error(`lighthouse returned nothing for ${url}`);
process.stdout.write(JSON.stringify(result.lhr));
