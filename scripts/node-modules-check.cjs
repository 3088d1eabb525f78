// Exit 0 when node_modules already holds exactly the tree package-lock.json describes, so setup can
// skip `npm ci` for a node_modules that was installed by hand (it has no stamp yet).
// Evidence: npm's own record of what it installed (node_modules/.package-lock.json) matches the
// lock entry by entry, only optional (other-platform) packages are absent, and every recorded
// package folder still exists. Plain CommonJS because it runs before node_modules is trusted.
const fs = require('node:fs');
const path = require('node:path');

function check(root) {
  const lock = JSON.parse(fs.readFileSync(path.join(root, 'package-lock.json'), 'utf8'));
  const installed = JSON.parse(fs.readFileSync(path.join(root, 'node_modules', '.package-lock.json'), 'utf8'));
  const want = lock.packages ?? {};
  const have = installed.packages ?? {};
  const problems = [];
  for (const [key, entry] of Object.entries(want)) {
    if (key === '') continue;
    const got = have[key];
    if (!got) {
      if (!entry.optional) problems.push(`missing ${key}`);
      continue;
    }
    if (got.version !== entry.version || got.integrity !== entry.integrity || got.resolved !== entry.resolved) {
      problems.push(`differs ${key}`);
    }
  }
  for (const key of Object.keys(have)) {
    if (!want[key]) problems.push(`extraneous ${key}`);
    else if (!have[key].link && !fs.existsSync(path.join(root, key, 'package.json'))) problems.push(`folder gone ${key}`);
  }
  return problems;
}

try {
  const problems = check(process.argv[2] ?? process.cwd());
  if (problems.length) {
    console.error(problems.slice(0, 10).join('\n'));
    process.exit(1);
  }
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}
